import { json } from "@/lib/api/handler";
import { checkDatabase } from "@/lib/data/health";

/** Liveness and database reachability, for monitors and the test runner. No data is revealed. */
export async function GET() {
  const database = await checkDatabase();
  return json({ ok: database, database: database ? "ok" : "unreachable" }, { status: database ? 200 : 503 });
}
