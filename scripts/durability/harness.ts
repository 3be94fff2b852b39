/**
 * What the crash and concurrency tests share: a temp installation, production servers started
 * from the build in the working directory (each in its own process group, so SIGKILL takes the
 * whole tree), and a small cookie-keeping HTTP client. Plain Node, run with tsx.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";

export const DEMO = {
  installer: { email: "installer@flueward.test", password: "ember-trowel-lantern" },
  supervisor: { email: "supervisor@flueward.test", password: "copper-meadow-ledger" },
} as const;

export const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));
export const sha256 = (bytes: Uint8Array) => crypto.createHash("sha256").update(bytes).digest("hex");
export const randomInt = (lo: number, hi: number) => lo + Math.floor(Math.random() * (hi - lo + 1));

export interface Installation {
  dir: string;
  dbFile: string;
  uploadsDir: string;
  env: NodeJS.ProcessEnv;
}

/** A temp data folder, migrated and seeded with the demo by scripts/prepare-db.ts. */
export function prepareInstallation(prefix: string): Installation {
  if (!fs.existsSync(path.join(process.cwd(), ".next", "BUILD_ID"))) {
    throw new Error("No production build in this folder: run `npx next build` first (these tests start `next start`).");
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), prefix));
  const dbFile = path.join(dir, "flueward.sqlite");
  const uploadsDir = path.join(dir, "uploads");
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    FLUEWARD_DB_FILE: dbFile,
    FLUEWARD_UPLOADS_DIR: uploadsDir,
    STORAGE_DRIVER: "disk",
    // Fixed for the run, so cookies stay valid across restarts; plain HTTP on loopback.
    SESSION_SECRET: crypto.randomBytes(32).toString("hex"),
    COOKIE_SECURE: "false",
    PUBLIC_BASE_URL: "http://flueward.test",
  };
  delete env.DATABASE_URL;
  delete env.FLUEWARD_SKIP_SEED;
  const result = spawnSync("npx", ["tsx", "scripts/prepare-db.ts"], { cwd: process.cwd(), env, encoding: "utf8", timeout: 120_000 });
  if (result.status !== 0) throw new Error(`prepare-db failed: ${result.stderr || result.stdout}`);
  return { dir, dbFile, uploadsDir, env };
}

/** A free loopback port in [lo, hi], tried in random order. */
export async function freePort(lo = 3400, hi = 3499, avoid: number[] = []): Promise<number> {
  const candidates = Array.from({ length: hi - lo + 1 }, (_, i) => lo + i).filter((p) => !avoid.includes(p)).sort(() => Math.random() - 0.5);
  for (const port of candidates) {
    const free = await new Promise<boolean>((resolve) => {
      const server = net.createServer();
      server.once("error", () => resolve(false));
      server.listen(port, "127.0.0.1", () => server.close(() => resolve(true)));
    });
    if (free) return port;
  }
  throw new Error(`No free port in ${lo}–${hi}.`);
}

export class AppServer {
  child: ChildProcess | null = null;
  starts = 0;
  readonly base: string;
  private readonly logFd: number;

  constructor(
    readonly port: number,
    private readonly installation: Installation,
    readonly logFile: string,
  ) {
    this.base = `http://127.0.0.1:${port}`;
    this.logFd = fs.openSync(logFile, "a");
  }

  /** Starts `next start` in its own process group and waits for /api/health (at most timeoutMs). */
  async start(timeoutMs = 30_000): Promise<number> {
    const began = Date.now();
    const nextBin = path.join(process.cwd(), "node_modules", "next", "dist", "bin", "next");
    this.child = spawn(process.execPath, [nextBin, "start", "-p", String(this.port), "-H", "127.0.0.1"], {
      cwd: process.cwd(),
      env: this.installation.env,
      detached: true,
      stdio: ["ignore", this.logFd, this.logFd],
    });
    this.starts += 1;
    const child = this.child;
    while (Date.now() - began < timeoutMs) {
      if (child.exitCode !== null || child.signalCode !== null) throw new Error(`next start exited (${child.exitCode ?? child.signalCode}); see ${this.logFile}`);
      try {
        const res = await fetch(`${this.base}/api/health`, { signal: AbortSignal.timeout(2_000) });
        if (res.status === 200) return Date.now() - began;
      } catch {
        // not listening yet
      }
      await sleep(40);
    }
    throw new Error(`next start did not answer /api/health within ${timeoutMs} ms; see ${this.logFile}`);
  }

  /** Kills the whole process group at once and waits until the leader is gone. */
  async kill(signal: NodeJS.Signals = "SIGKILL"): Promise<void> {
    const child = this.child;
    if (!child?.pid) return;
    const exited = child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise<void>((resolve) => child.once("exit", () => resolve()));
    try {
      process.kill(-child.pid, signal);
    } catch {
      // already gone
    }
    await Promise.race([exited, sleep(10_000)]);
    this.child = null;
  }

  close(): void {
    fs.closeSync(this.logFd);
  }
}

export interface Reply<T = Record<string, unknown>> {
  status: number;
  body: T;
  text: string;
}

/** Thrown when no complete answer arrived (connection refused or cut, timeout). */
export class NoAnswer extends Error {}

/** An HTTP client for one signed-in member; the session cookie is kept across servers and restarts. */
export class Client {
  cookie = "";
  constructor(
    public base: string,
    readonly account: { email: string; password: string },
  ) {}

  async request<T = Record<string, unknown>>(method: string, url: string, options: { json?: unknown; form?: FormData; timeoutMs?: number; base?: string } = {}): Promise<Reply<T>> {
    const headers: Record<string, string> = {};
    if (this.cookie) headers.cookie = this.cookie;
    let body: BodyInit | undefined;
    if (options.json !== undefined) {
      headers["content-type"] = "application/json";
      body = JSON.stringify(options.json);
    } else if (options.form) body = options.form;
    let res: Response;
    let text: string;
    try {
      res = await fetch(`${options.base ?? this.base}${url}`, { method, headers, body, signal: AbortSignal.timeout(options.timeoutMs ?? 20_000), redirect: "manual" });
      text = await res.text();
    } catch (error) {
      throw new NoAnswer(error instanceof Error ? `${error.message} ${String((error as { cause?: unknown }).cause ?? "")}` : String(error));
    }
    const setCookie = res.headers.getSetCookie?.() ?? [];
    for (const c of setCookie) if (c.startsWith("flueward-session=")) this.cookie = c.split(";")[0]!;
    let parsed: unknown = {};
    try {
      parsed = text ? JSON.parse(text) : {};
    } catch {
      parsed = {};
    }
    return { status: res.status, body: parsed as T, text };
  }

  async signIn(base = this.base): Promise<void> {
    const reply = await this.request("POST", "/api/auth/sign-in", { json: this.account, base });
    if (reply.status !== 200 || !this.cookie) throw new Error(`sign-in of ${this.account.email} answered ${reply.status}: ${reply.text.slice(0, 200)}`);
  }
}

/** A drawn-looking signature PNG as a data URL (the approve and submit APIs check it is not blank). */
export async function signaturePng(): Promise<string> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="300" height="100"><polyline points="10,70 60,30 110,75 160,25 210,70 260,35" fill="none" stroke="#111" stroke-width="5"/></svg>`;
  return `data:image/png;base64,${(await sharp(Buffer.from(svg)).png().toBuffer()).toString("base64")}`;
}

/** The documented example request as inspection data (a full vent run, air space and readings). */
export function exampleInspectionData(notes = ""): Record<string, unknown> {
  const example = JSON.parse(fs.readFileSync(path.join(process.cwd(), "docs/examples/check-request.json"), "utf8"));
  return { appliances: example.appliances, ventRun: example.ventRun, airSpace: example.airSpace, readings: example.readings, removedAppliances: [], siteChecks: {}, justifications: {}, notes };
}

type Finding = { code: string; status: string; target: { path: string } };

/** Justifications for every fail and needs-info finding, so the draft can be submitted. */
export function justificationsFor(findings: Finding[]): Record<string, { text: string; reference: string }> {
  return Object.fromEntries(
    findings.filter((f) => f.status === "fail" || f.status === "needs-info").map((f) => [`${f.code}@${f.target.path}`, { text: "Allowed by the manufacturer's installation instructions, page 12.", reference: "p. 12" }]),
  );
}

export function tail(file: string, lines = 30): string {
  try {
    return fs.readFileSync(file, "utf8").split("\n").slice(-lines).join("\n");
  } catch {
    return "";
  }
}
