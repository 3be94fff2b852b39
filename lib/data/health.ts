import "server-only";
import { getDb } from "@/db/knex";

export async function checkDatabase(): Promise<boolean> {
  try {
    await getDb().raw("select 1");
    return true;
  } catch {
    return false;
  }
}
