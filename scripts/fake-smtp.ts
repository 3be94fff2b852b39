/**
 * A local stand-in for a real mail server, for development, the demo and the tests. It accepts
 * every message on 127.0.0.1 only (no TLS, any or no sign-in), parses it and writes it as one
 * JSON file into the outbox folder, where the app's /dev/outbox page shows it.
 *
 *   npx tsx scripts/fake-smtp.ts        # FAKE_SMTP_PORT (2525), FLUEWARD_OUTBOX_DIR (data/outbox)
 *
 * To exercise failed sends: FAKE_SMTP_FAIL=1 refuses the first message after start, and a file
 * named `.fail-next` in the outbox folder refuses the next message (the flag is removed when
 * used). When the file holds an address, only the next message to that address is refused, so a
 * test can fail its own send while others run. Both answer 451, a temporary error, as a busy real
 * server would.
 */
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { AddressInfo } from "node:net";
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { FAIL_NEXT_FLAG, defaultOutboxDir, newOutboxId, type StoredOutboxMessage } from "../lib/mail/outbox-format";

export const DEFAULT_FAKE_SMTP_PORT = 2525;
const MAX_MESSAGE_BYTES = 30 * 1024 * 1024;

export interface FakeSmtpOptions {
  /** 0 picks a free port (see the returned `port`). */
  port: number;
  outboxDir: string;
  /** Refuse the first message received with a 451 (FAKE_SMTP_FAIL=1 when run as a script). */
  failFirst?: boolean;
  /** Print one line per message. */
  log?: boolean;
}

export interface FakeSmtp {
  port: number;
  outboxDir: string;
  close(): Promise<void>;
}

function temporaryFailure(): Error {
  return Object.assign(new Error("Temporary failure: the fake mail server was told to refuse this message. Try again."), { responseCode: 451 });
}

function addressList(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  const objects = Array.isArray(value) ? value : [value];
  return objects.flatMap((o) => o.value.map((a) => a.address ?? "").filter(Boolean));
}

/**
 * Takes the `.fail-next` flag if it is there and meant for this message (empty, or naming one of
 * `recipients`); removing it first means two messages cannot both take it.
 */
async function takeFailFlag(outboxDir: string, recipients: string[]): Promise<boolean> {
  const flag = path.join(outboxDir, FAIL_NEXT_FLAG);
  let onlyFor: string;
  try {
    onlyFor = (await fs.promises.readFile(flag, "utf8")).trim().toLowerCase();
  } catch {
    return false;
  }
  if (onlyFor && !recipients.some((r) => r.toLowerCase() === onlyFor)) return false;
  try {
    await fs.promises.unlink(flag);
    return true;
  } catch {
    return false;
  }
}

async function readStream(stream: SMTPServerDataStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

async function writeAtomically(outboxDir: string, message: StoredOutboxMessage): Promise<void> {
  const finalPath = path.join(outboxDir, `${message.id}.json`);
  const tempPath = path.join(outboxDir, `.tmp-${message.id}.json`);
  await fs.promises.writeFile(tempPath, JSON.stringify(message, null, 2));
  // A reader sees the whole file or none of it.
  await fs.promises.rename(tempPath, finalPath);
}

/** Starts the fake server on 127.0.0.1. */
export async function startFakeSmtp(options: FakeSmtpOptions): Promise<FakeSmtp> {
  const outboxDir = path.resolve(options.outboxDir);
  await fs.promises.mkdir(outboxDir, { recursive: true });
  let failFirst = options.failFirst ?? false;

  const server = new SMTPServer({
    name: "fake-smtp.flueward.test",
    banner: "Flueward fake mail server: messages go to a local folder, nothing leaves this machine",
    authOptional: true,
    allowInsecureAuth: true,
    disabledCommands: ["STARTTLS"],
    hideSTARTTLS: true,
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onAuth(_auth, _session, callback) {
      callback(null, { user: "fake" });
    },
    onData(stream: SMTPServerDataStream, session: SMTPServerSession, callback: (err?: Error | null, message?: string) => void) {
      void (async () => {
        const raw = await readStream(stream);
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error("Message too large for the fake mail server."), { responseCode: 552 }));
          return;
        }
        const refuse = failFirst || (await takeFailFlag(outboxDir, session.envelope.rcptTo.map((r) => r.address)));
        failFirst = false;
        if (refuse) {
          if (options.log) console.log("[fake-smtp] refused a message with 451 (fail flag)");
          callback(temporaryFailure());
          return;
        }
        const parsed = await simpleParser(raw);
        const receivedAt = new Date();
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
        const message: StoredOutboxMessage = {
          id: newOutboxId(receivedAt),
          from: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ""),
          to: envelopeTo.length ? envelopeTo : addressList(parsed.to),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
          attachments: parsed.attachments.map((a) => ({
            filename: a.filename ?? "",
            contentType: a.contentType,
            size: a.content.length,
            sha256: crypto.createHash("sha256").update(a.content).digest("hex"),
          })),
          messageId: parsed.messageId ?? "",
          receivedAt: receivedAt.toISOString(),
        };
        await writeAtomically(outboxDir, message);
        if (options.log) console.log(`[fake-smtp] ${message.receivedAt} to ${message.to.join(", ")}: ${message.subject}`);
        callback(null, `Stored as ${message.id}`);
      })().catch((error: unknown) => {
        console.error("[fake-smtp] could not store a message:", error);
        callback(Object.assign(new Error("The fake mail server could not store the message."), { responseCode: 451 }));
      });
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, "127.0.0.1", () => {
      server.off("error", reject);
      resolve();
    });
  });
  server.on("error", (error) => console.error("[fake-smtp]", error));
  const port = (server.server.address() as AddressInfo).port;

  return {
    port,
    outboxDir,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

async function main() {
  const port = Number(process.env.FAKE_SMTP_PORT ?? DEFAULT_FAKE_SMTP_PORT);
  const outboxDir = defaultOutboxDir();
  const smtp = await startFakeSmtp({ port, outboxDir, failFirst: process.env.FAKE_SMTP_FAIL === "1", log: true });
  console.log(`[fake-smtp] listening on 127.0.0.1:${smtp.port}; messages go to ${smtp.outboxDir}`);
  const stop = () => {
    void smtp.close().then(() => process.exit(0));
    // The server waits for open connections; do not hang on one.
    setTimeout(() => process.exit(0), 2_000).unref();
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

const invokedAs = process.argv[1] ? path.basename(process.argv[1]) : "";
if (/^fake-smtp(\.ts|\.js)?$/.test(invokedAs)) {
  main().catch((error) => {
    console.error("[fake-smtp] could not start:", error);
    process.exit(1);
  });
}
