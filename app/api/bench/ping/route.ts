/**
 * A constant answer with no session, database or parsing: the ceiling the load benchmark
 * compares every real endpoint against. It exists only while FLUEWARD_BENCH=1 (set by
 * bench/load.bench.ts); everywhere else it is a plain 404, so production exposes nothing.
 */
const PONG = JSON.stringify({ ok: true });

export const dynamic = "force-dynamic";

export function GET(): Response {
  if (process.env.FLUEWARD_BENCH !== "1") {
    return Response.json({ error: { code: "not_found", message: "Not found." } }, { status: 404 });
  }
  return new Response(PONG, { status: 200, headers: { "Content-Type": "application/json", "Cache-Control": "no-store" } });
}
