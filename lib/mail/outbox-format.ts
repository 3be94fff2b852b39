import crypto from "node:crypto";
import path from "node:path";

/**
 * The development outbox: a folder of JSON files, one per message the local fake SMTP server
 * received. Shared by the fake server (which writes) and the app's dev outbox page (which reads),
 * so both agree on the folder and the file format.
 */
export interface OutboxAttachment {
  filename: string;
  contentType: string;
  size: number;
  sha256: string;
}

export interface StoredOutboxMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  attachments: OutboxAttachment[];
  messageId: string;
  receivedAt: string;
}

/** A message file name: its id (UTC time to the millisecond, then 8 random hex digits) + ".json". */
export const OUTBOX_ID_PATTERN = /^\d{8}T\d{9}Z-[0-9a-f]{8}$/;

/** The folder named by FLUEWARD_OUTBOX_DIR, or data/outbox under the working directory. */
export function defaultOutboxDir(env: Record<string, string | undefined> = process.env): string {
  return env.FLUEWARD_OUTBOX_DIR ? path.resolve(env.FLUEWARD_OUTBOX_DIR) : path.join(/* turbopackIgnore: true */ process.cwd(), "data", "outbox");
}

/** A new message id; ids sort in the order the messages arrived. */
export function newOutboxId(at: Date = new Date()): string {
  const stamp = at.toISOString().replace(/[-:]/g, "").replace(".", "");
  return `${stamp}-${crypto.randomBytes(4).toString("hex")}`;
}

/** The name of the flag file that makes the fake server refuse the next message with a 451. */
export const FAIL_NEXT_FLAG = ".fail-next";
