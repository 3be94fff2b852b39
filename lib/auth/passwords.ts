import "server-only";
import { Worker } from "node:worker_threads";
import { createRequire } from "node:module";
import path from "node:path";

/**
 * bcrypt hashing and comparison on a worker thread.
 *
 * bcrypt is deliberately slow (about 100 ms at cost 10 on one core here) and bcryptjs runs in
 * JavaScript: on the main thread a burst of sign-in attempts would stall every other request.
 * One worker is enough on a two-core machine; calls queue in order.
 */
export const BCRYPT_COST = 11;

/** A valid hash of a random string: compared against when the e-mail is unknown, so both paths cost the same. */
const DUMMY_HASH = "$2b$11$OXBvAM.dBTgqZMISyo2vc.NsP9iE.xfaehIprOusqXHAR1QNQjKGq";

const WORKER_SOURCE = `
const { parentPort, workerData } = require("node:worker_threads");
const bcrypt = require(workerData.bcryptPath);
parentPort.on("message", (msg) => {
  try {
    const result = msg.op === "hash" ? bcrypt.hashSync(msg.password, msg.cost) : bcrypt.compareSync(msg.password, msg.hash);
    parentPort.postMessage({ id: msg.id, result });
  } catch (error) {
    parentPort.postMessage({ id: msg.id, error: String(error && error.message || error) });
  }
});
`;

type Pending = { resolve: (value: unknown) => void; reject: (error: Error) => void };
const globalForWorker = globalThis as unknown as {
  fluewardHashWorker?: { worker: Worker; pending: Map<number, Pending>; nextId: number };
};

function hashWorker() {
  if (globalForWorker.fluewardHashWorker) return globalForWorker.fluewardHashWorker;
  const requireFromApp = createRequire(path.join(/* turbopackIgnore: true */ process.cwd(), "package.json"));
  const worker = new Worker(WORKER_SOURCE, { eval: true, workerData: { bcryptPath: requireFromApp.resolve("bcryptjs") } });
  worker.unref();
  const state = { worker, pending: new Map<number, Pending>(), nextId: 1 };
  worker.on("message", (msg: { id: number; result?: unknown; error?: string }) => {
    const waiting = state.pending.get(msg.id);
    if (!waiting) return;
    state.pending.delete(msg.id);
    if (msg.error) waiting.reject(new Error(msg.error));
    else waiting.resolve(msg.result);
  });
  worker.on("error", (error) => {
    for (const waiting of state.pending.values()) waiting.reject(error);
    state.pending.clear();
    globalForWorker.fluewardHashWorker = undefined;
  });
  globalForWorker.fluewardHashWorker = state;
  return state;
}

function run<T>(message: Record<string, unknown>): Promise<T> {
  const state = hashWorker();
  const id = state.nextId++;
  return new Promise<T>((resolve, reject) => {
    state.pending.set(id, { resolve: resolve as (v: unknown) => void, reject });
    state.worker.postMessage({ ...message, id });
  });
}

export function hashPassword(password: string): Promise<string> {
  return run<string>({ op: "hash", password, cost: BCRYPT_COST });
}

/** Compares a password with a stored hash; with no hash (unknown account) it still does the work and returns false. */
export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const matches = await run<boolean>({ op: "compare", password, hash: hash ?? DUMMY_HASH });
  return Boolean(hash) && matches;
}
