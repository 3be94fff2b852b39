import "server-only";
import fs from "node:fs";
import path from "node:path";
import { z } from "zod";
import { OUTBOX_ID_PATTERN, defaultOutboxDir, type OutboxAttachment, type StoredOutboxMessage } from "./outbox-format";

/**
 * Reads the development outbox the local fake SMTP server writes (scripts/fake-smtp.ts). Only
 * for development, the demo and the end-to-end tests: the page and the API answer 404 elsewhere.
 */
export type { OutboxAttachment };

export interface OutboxSummary {
  id: string;
  from: string;
  to: string[];
  subject: string;
  receivedAt: string;
  attachmentCount: number;
}

export interface OutboxMessage extends StoredOutboxMessage {
  /** Every http(s) link in the text and HTML bodies, in order, without repeats. */
  links: string[];
}

export const OUTBOX_LIST_MAX = 200;

/** True outside production, or when FLUEWARD_DEV_OUTBOX=1 (the demo and the end-to-end server). */
export function outboxEnabled(env: Record<string, string | undefined> = process.env): boolean {
  return env.NODE_ENV !== "production" || env.FLUEWARD_DEV_OUTBOX === "1";
}

export function outboxDir(): string {
  return defaultOutboxDir();
}

function decodeEntities(value: string): string {
  return value
    .replace(/&quot;/g, '"')
    .replace(/&#39;|&#x27;/g, "'")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&amp;/g, "&");
}

/** The http(s) links of a message: hrefs in the HTML, then bare URLs in the text. */
export function extractLinks(text: string, html: string): string[] {
  const found: string[] = [];
  for (const match of html.matchAll(/href\s*=\s*["']([^"']+)["']/gi)) found.push(decodeEntities(match[1] ?? ""));
  for (const match of text.matchAll(/https?:\/\/[^\s<>"')\]]+/g)) found.push(match[0].replace(/[.,;:!?]+$/, ""));
  return [...new Set(found.filter((link) => /^https?:\/\//i.test(link)))];
}

async function readMessageFile(dir: string, id: string): Promise<StoredOutboxMessage | null> {
  try {
    const parsed = JSON.parse(await fs.promises.readFile(path.join(dir, `${id}.json`), "utf8")) as Partial<StoredOutboxMessage>;
    return {
      id,
      from: String(parsed.from ?? ""),
      to: Array.isArray(parsed.to) ? parsed.to.map(String) : [],
      subject: String(parsed.subject ?? ""),
      text: String(parsed.text ?? ""),
      html: String(parsed.html ?? ""),
      attachments: Array.isArray(parsed.attachments) ? parsed.attachments : [],
      messageId: String(parsed.messageId ?? ""),
      receivedAt: String(parsed.receivedAt ?? ""),
    };
  } catch {
    // Removed between listing and reading, or not one of ours.
    return null;
  }
}

/** The query of GET /api/dev/outbox: how many messages, optionally only those to one address. */
export const outboxQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(OUTBOX_LIST_MAX).default(50),
  to: z.string().trim().max(254).optional(),
});

async function readNewest(args: { limit?: number; to?: string }): Promise<StoredOutboxMessage[]> {
  const limit = Math.max(1, Math.min(args.limit ?? 50, OUTBOX_LIST_MAX));
  const dir = outboxDir();
  let names: string[];
  try {
    names = await fs.promises.readdir(dir);
  } catch {
    return [];
  }
  const ids = names
    .filter((name) => name.endsWith(".json"))
    .map((name) => name.slice(0, -".json".length))
    .filter((id) => OUTBOX_ID_PATTERN.test(id))
    .sort()
    .reverse();
  const to = args.to?.toLowerCase();
  const out: StoredOutboxMessage[] = [];
  // Read in pages so a filter by recipient still finds `limit` matches without reading everything at once.
  for (let start = 0; start < ids.length && out.length < limit; start += limit) {
    const page = await Promise.all(ids.slice(start, start + limit).map((id) => readMessageFile(dir, id)));
    for (const message of page) {
      if (!message) continue;
      if (to && !message.to.some((address) => address.toLowerCase() === to)) continue;
      out.push(message);
      if (out.length >= limit) break;
    }
  }
  return out;
}

/** The newest messages first, as summaries. */
export async function listOutbox(args: { limit?: number; to?: string } = {}): Promise<OutboxSummary[]> {
  const messages = await readNewest(args);
  return messages.map((m) => ({ id: m.id, from: m.from, to: m.to, subject: m.subject, receivedAt: m.receivedAt, attachmentCount: m.attachments.length }));
}

/** The newest messages first, whole, with their links (for the end-to-end tests). */
export async function listOutboxMessages(args: { limit?: number; to?: string } = {}): Promise<OutboxMessage[]> {
  const messages = await readNewest(args);
  return messages.map((m) => ({ ...m, links: extractLinks(m.text, m.html) }));
}

/** One message with its links, or null (also for anything that is not a message id). */
export async function getOutboxMessage(id: string): Promise<OutboxMessage | null> {
  if (!OUTBOX_ID_PATTERN.test(id)) return null;
  const message = await readMessageFile(outboxDir(), id);
  if (!message) return null;
  return { ...message, links: extractLinks(message.text, message.html) };
}
