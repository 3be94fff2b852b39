import "server-only";
import fs from "node:fs";
import path from "node:path";
import crypto from "node:crypto";

/**
 * The session-sealing secret: SESSION_SECRET from the environment, or (for development and the
 * demo) a random one generated once into the git-ignored .secrets/ folder. Never committed.
 * SESSION_SECRET may hold several comma-separated secrets, newest first, to rotate keys.
 */
let memo: { env: string | undefined; passwords: Record<string, string> } | null = null;

export function sessionPasswords(): Record<string, string> {
  const env = process.env.SESSION_SECRET;
  if (memo && memo.env === env) return memo.passwords;
  const passwords = buildPasswords();
  memo = { env, passwords };
  return passwords;
}

function buildPasswords(): Record<string, string> {
  const fromEnv = process.env.SESSION_SECRET?.split(",").map((s) => s.trim()).filter(Boolean);
  const secrets = fromEnv && fromEnv.length > 0 ? fromEnv : [developmentSecret()];
  for (const secret of secrets) {
    if (secret.length < 32) throw new Error("SESSION_SECRET must be at least 32 characters long.");
  }
  // iron-session seals with the highest-numbered password and unseals with any of them.
  const passwords: Record<string, string> = {};
  secrets.forEach((secret, index) => {
    passwords[String(secrets.length - index)] = secret;
  });
  return passwords;
}

function developmentSecret(): string {
  const dir = path.join(/* turbopackIgnore: true */ process.cwd(), ".secrets");
  const file = path.join(dir, "session-secret");
  try {
    const existing = fs.readFileSync(file, "utf8").trim();
    if (existing.length >= 32) return existing;
  } catch {
    // not generated yet
  }
  const secret = crypto.randomBytes(32).toString("base64url");
  fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
  fs.writeFileSync(file, secret + "\n", { mode: 0o600 });
  return secret;
}
