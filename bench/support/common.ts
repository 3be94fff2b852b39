/**
 * Shared parts of the benchmarks: where the seeded database lives, starting and stopping the
 * production server built in the current folder, signing in, statistics and result files.
 */
import { spawn, type ChildProcess } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

export const ROOT = process.cwd();
export const RESULTS_DIR = path.join(ROOT, "bench", "results");

/** The large seeded database (bench/seed-large.ts writes it; bench/results is git-ignored). */
export const LARGE_DB_FILE = process.env.FLUEWARD_BENCH_DB ?? path.join(RESULTS_DIR, "large.sqlite");

/** The load generator and the server share this machine's cores: every report says so. */
export const SHARED_CORES_NOTE = "The load generator (autocannon) runs on the same machine and shares its cores with the server: figures are a floor, not the server's capacity.";

export const DEMO_INSTALLER = { email: "installer@flueward.test", password: "ember-trowel-lantern" } as const;

export function writeResult(name: string, result: unknown): string {
  fs.mkdirSync(RESULTS_DIR, { recursive: true });
  const file = path.join(RESULTS_DIR, `${name}.json`);
  fs.writeFileSync(file, `${JSON.stringify(result, null, 2)}\n`);
  return path.relative(ROOT, file);
}

export function median(values: readonly number[]): number {
  return quantile(values, 0.5);
}

export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

export const round = (value: number, digits = 1) => Math.round(value * 10 ** digits) / 10 ** digits;

export function assertBuilt(): void {
  if (!fs.existsSync(path.join(ROOT, ".next", "BUILD_ID"))) {
    console.error("No production build here: run `npx next build` first (npm run bench does).");
    process.exit(2);
  }
}

export function assertSeeded(): void {
  if (!fs.existsSync(LARGE_DB_FILE)) {
    console.error(`No seeded database at ${LARGE_DB_FILE}: run \`npx tsx bench/seed-large.ts\` first.`);
    process.exit(2);
  }
}

/** Copies a SQLite file (after its writer has closed it, so the WAL is checkpointed) to a scratch file. */
export function scratchCopy(source: string, name: string): string {
  const target = path.join(RESULTS_DIR, `${name}.sqlite`);
  for (const suffix of ["", "-wal", "-shm"]) fs.rmSync(target + suffix, { force: true });
  fs.copyFileSync(source, target);
  return target;
}

export interface BenchServer {
  base: string;
  child: ChildProcess;
  log: () => string;
  stop: () => Promise<void>;
}

/**
 * Starts `next start` (the build in the current folder) on loopback with the given database.
 * FLUEWARD_BENCH=1 enables the constant ceiling route; cookies are sent without Secure (plain HTTP).
 */
export async function startServer(options: { port: number; dbFile: string; env?: Record<string, string> }): Promise<BenchServer> {
  assertBuilt();
  const nextBin = path.join(ROOT, "node_modules", "next", "dist", "bin", "next");
  let output = "";
  const child = spawn(process.execPath, [nextBin, "start", "-p", String(options.port), "-H", "127.0.0.1"], {
    cwd: ROOT,
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      FLUEWARD_BENCH: "1",
      FLUEWARD_DB_FILE: options.dbFile,
      FLUEWARD_SKIP_SEED: "1",
      COOKIE_SECURE: "false",
      SESSION_SECRET: process.env.SESSION_SECRET ?? crypto.randomBytes(32).toString("base64url"),
      ...options.env,
    },
  });
  child.stdout?.on("data", (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on("data", (chunk: Buffer) => (output += chunk.toString()));
  const base = `http://127.0.0.1:${options.port}`;
  const stop = async () => {
    if (child.exitCode !== null || child.pid === undefined) return;
    const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
    try {
      process.kill(-child.pid, "SIGTERM");
    } catch {
      return;
    }
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, "SIGKILL");
      } catch {
        /* already gone */
      }
    }, 5_000);
    await exited;
    clearTimeout(timer);
  };
  // Never leave a server behind, whatever way this process ends.
  process.once("exit", () => {
    if (child.exitCode === null && child.pid !== undefined) {
      try {
        process.kill(-child.pid, "SIGKILL");
      } catch {
        /* already gone */
      }
    }
  });
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The server exited (${child.exitCode}):\n${output}`);
    try {
      const response = await fetch(`${base}/api/health`);
      if (response.ok) break;
    } catch {
      /* not listening yet */
    }
    if (Date.now() > deadline) {
      await stop();
      throw new Error(`The server did not answer /api/health within 30 s:\n${output}`);
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  return { base, child, log: () => output, stop };
}

/** Signs in through the API and returns the Cookie header value of the new session. */
export async function signIn(base: string, account: { email: string; password: string } = DEMO_INSTALLER): Promise<string> {
  const response = await fetch(`${base}/api/auth/sign-in`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Origin: base },
    body: JSON.stringify(account),
  });
  if (!response.ok) throw new Error(`Sign-in as ${account.email} failed: ${response.status} ${await response.text()}`);
  const cookies = response.headers.getSetCookie().map((c) => c.split(";")[0]!);
  if (cookies.length === 0) throw new Error("Sign-in answered without a session cookie.");
  return cookies.join("; ");
}

/** Picks a free port in the benchmarks' range (3500–3599), preferring the given one. */
export async function freePort(preferred: number): Promise<number> {
  const net = await import("node:net");
  const tryPort = (port: number) =>
    new Promise<boolean>((resolve) => {
      const server = net.createServer();
      server.once("error", () => resolve(false));
      server.listen(port, "127.0.0.1", () => server.close(() => resolve(true)));
    });
  for (let port = preferred; port < 3600; port++) if (await tryPort(port)) return port;
  for (let port = 3500; port < preferred; port++) if (await tryPort(port)) return port;
  throw new Error("No free port in 3500–3599.");
}

/**
 * The 1-minute load average when a timing benchmark starts. Anything well above zero means other
 * work shares the cores and the figures are lower than the app's own: the report carries it.
 */
export function machineLoad(): { loadAverage1m: number; cores: number; busy: boolean; warning: string | null } {
  const loadAverage1m = round(os.loadavg()[0]!, 2);
  const cores = os.cpus().length;
  const busy = loadAverage1m > 0.5 * cores;
  return { loadAverage1m, cores, busy, warning: busy ? `machine busy before the run: load average ${loadAverage1m} on ${cores} cores; timings are depressed by other work` : null };
}
