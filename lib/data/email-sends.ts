import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import { deliverMail, describeSendError } from "@/lib/mail/transport";
import { getStorage } from "@/lib/storage";
import { recordAudit, type AuditActor } from "./audit";
import { isoPlus, nowIso } from "./clock";

/**
 * E-mails that take a record to someone outside the company, with their outcome. One press of
 * "Send" is one row, keyed by the browser's idempotency key: pressing again, or twice at once,
 * finds the row instead of sending a second message. Failed sends keep their message so they
 * can be retried; a retry claims the row (failed → sending) before it sends, so two retries at
 * once send once.
 */
export type EmailSendStatus = "sending" | "sent" | "failed";

export interface EmailSend {
  id: number;
  recordId: number;
  shareLinkId: number | null;
  toAddress: string;
  subject: string;
  attachPdf: boolean;
  status: EmailSendStatus;
  attempts: number;
  lastError: string | null;
  messageId: string | null;
  createdBy: number | null;
  createdAt: string;
  updatedAt: string;
}

/** The message as composed by the caller (see lib/mail/record-email.ts). */
export interface RecordEmailMessage {
  subject: string;
  text: string;
  html: string;
}

export interface RecordEmailAttachment {
  filename: string;
  contentType: string;
  content: Uint8Array;
}

export interface SendRecordEmailResult {
  emailSend: EmailSend;
  /** True when the key had been used already: nothing was sent by this call. */
  duplicate: boolean;
}

/** A send still "sending" after this long was interrupted (the transport gives up within seconds). */
export const STALE_SENDING_MS = 5 * 60_000;
export const IDEMPOTENCY_KEY_PATTERN = /^[A-Za-z0-9_-]{8,100}$/;
const EMAIL_PATTERN = /^[^\s@<>()",;:\\]+@[^\s@<>()",;:\\]+\.[^\s@<>()",;:\\]+$/;

type Row = Record<string, unknown>;

function toEmailSend(row: Row): EmailSend {
  return {
    id: row.id as number,
    recordId: row.record_id as number,
    shareLinkId: (row.share_link_id as number | null) ?? null,
    toAddress: row.to_address as string,
    subject: row.subject as string,
    attachPdf: Boolean(row.attach_pdf),
    status: row.status as EmailSendStatus,
    attempts: Number(row.attempts),
    lastError: (row.last_error as string | null) ?? null,
    messageId: (row.message_id as string | null) ?? null,
    createdBy: (row.created_by as number | null) ?? null,
    createdAt: row.created_at as string,
    updatedAt: row.updated_at as string,
  };
}

function insertedId(row: unknown): number {
  return typeof row === "object" && row !== null ? (row as { id: number }).id : (row as number);
}

function isUniqueViolation(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return code === "SQLITE_CONSTRAINT_UNIQUE" || code === "23505";
}

function pendingKey(companyId: number, emailSendId: number): string {
  return `mail-pending/c${companyId}/e${emailSendId}.json`;
}

interface PendingMessage {
  to: string;
  message: RecordEmailMessage;
  attachment: { filename: string; contentType: string; contentBase64: string } | null;
}

function toPendingAttachment(attachment: RecordEmailAttachment): NonNullable<PendingMessage["attachment"]> {
  return { filename: attachment.filename, contentType: attachment.contentType, contentBase64: Buffer.from(attachment.content).toString("base64") };
}

function validateSend(args: { to: string; idempotencyKey: string; message: RecordEmailMessage }): string {
  const to = args.to.trim();
  const fields: Record<string, string> = {};
  if (!IDEMPOTENCY_KEY_PATTERN.test(args.idempotencyKey)) fields.idempotencyKey = "A send key of 8–100 letters, digits, '-' or '_' is needed.";
  if (to.length > 254 || !EMAIL_PATTERN.test(to)) fields.to = "Enter one e-mail address, like name@example.com.";
  if (!args.message.subject.trim() || /[\r\n]/.test(args.message.subject)) fields.subject = "The subject must be one line of text.";
  if (Object.keys(fields).length) throw new AppError("validation_failed", undefined, { fields });
  return to;
}

async function findByKey(db: Knex | Knex.Transaction, companyId: number, idempotencyKey: string): Promise<Row | undefined> {
  return db("email_sends").where({ company_id: companyId, idempotency_key: idempotencyKey }).first();
}

async function savePending(companyId: number, emailSendId: number, pending: PendingMessage): Promise<boolean> {
  try {
    await getStorage().put(pendingKey(companyId, emailSendId), new TextEncoder().encode(JSON.stringify(pending)), "application/json");
    return true;
  } catch (error) {
    // Sending still goes ahead; only a later retry would lack the message.
    console.error("[mail] could not keep the message for a retry", error);
    return false;
  }
}

async function loadPending(companyId: number, emailSendId: number): Promise<PendingMessage | null> {
  try {
    const bytes = await getStorage().get(pendingKey(companyId, emailSendId));
    return bytes ? (JSON.parse(new TextDecoder().decode(bytes)) as PendingMessage) : null;
  } catch (error) {
    console.error("[mail] could not read a kept message", error);
    return null;
  }
}

async function dropPending(companyId: number, emailSendId: number): Promise<void> {
  await getStorage()
    .delete(pendingKey(companyId, emailSendId))
    .catch((error: unknown) => console.error("[mail] could not remove a kept message", error));
}

/** Sends the message and records the outcome on the row (which must be 'sending') with an audit event. */
async function deliverAndRecord(args: {
  companyId: number;
  actor: AuditActor;
  emailSendId: number;
  pending: PendingMessage;
  retry: boolean;
}): Promise<EmailSend> {
  const { companyId, emailSendId, pending } = args;
  let outcome: { ok: true; messageId: string } | { ok: false; error: string };
  try {
    const attachments = pending.attachment
      ? [{ filename: pending.attachment.filename, contentType: pending.attachment.contentType, content: Buffer.from(pending.attachment.contentBase64, "base64") }]
      : [];
    const { messageId } = await deliverMail({ to: pending.to, ...pending.message, attachments });
    outcome = { ok: true, messageId };
  } catch (error) {
    outcome = { ok: false, error: describeSendError(error) };
    console.warn(`[mail] e-mail ${emailSendId} failed: ${outcome.error}`);
  }

  const db = getDb();
  await db.transaction(async (trx) => {
    const row = await trx("email_sends").where({ id: emailSendId, company_id: companyId }).first();
    if (!row) return;
    const now = nowIso();
    await trx("email_sends")
      .where({ id: emailSendId, company_id: companyId, status: "sending" })
      .update(
        outcome.ok
          ? { status: "sent", attempts: Number(row.attempts) + 1, message_id: outcome.messageId.slice(0, 300) || null, last_error: null, updated_at: now }
          : { status: "failed", attempts: Number(row.attempts) + 1, last_error: outcome.error.slice(0, 500), updated_at: now },
      );
    await recordAudit(trx, {
      companyId,
      actor: args.actor,
      action: outcome.ok ? "record.emailed" : "record.email_failed",
      entityType: "record",
      entityId: row.record_id as number,
      summary: outcome.ok
        ? `${args.retry ? "Resent" : "E-mailed"} the record to ${pending.to}${pending.attachment ? " with the PDF attached" : ""}`
        : `${args.retry ? "Resending" : "E-mailing"} the record to ${pending.to} failed: ${outcome.error}`,
      after: outcome.ok
        ? { emailSendId, to: pending.to, attachPdf: Boolean(pending.attachment), messageId: outcome.messageId, attempt: Number(row.attempts) + 1 }
        : { emailSendId, to: pending.to, attachPdf: Boolean(pending.attachment), error: outcome.error, attempt: Number(row.attempts) + 1 },
    });
  });
  if (outcome.ok) await dropPending(companyId, emailSendId);
  return getEmailSend({ companyId, id: emailSendId });
}

/**
 * Sends a record's e-mail once per idempotency key. The row is written first (status 'sending')
 * so that a second call with the same key — after the first finished, or while it is still
 * sending — returns that row and sends nothing. The record (and share link, when given) must
 * belong to the company: otherwise not_found. The caller checks the member's role.
 */
export async function sendRecordEmail(args: {
  companyId: number;
  actor: AuditActor;
  recordId: number;
  shareLinkId: number | null;
  to: string;
  idempotencyKey: string;
  message: RecordEmailMessage;
  attachment?: RecordEmailAttachment | null;
}): Promise<SendRecordEmailResult> {
  const to = validateSend(args);
  const db = getDb();
  const attachment = args.attachment ?? null;

  const sameRequest = (row: Row) => row.record_id === args.recordId && String(row.to_address).toLowerCase() === to.toLowerCase();
  const duplicateOf = (row: Row): SendRecordEmailResult => {
    if (!sameRequest(row)) throw new AppError("unprocessable", "This send key was already used for a different e-mail. Reload the page and send again.");
    return { emailSend: toEmailSend(row), duplicate: true };
  };

  let claimed: { id: number } | { existing: Row };
  try {
    claimed = await db.transaction(async (trx) => {
      const existing = await findByKey(trx, args.companyId, args.idempotencyKey);
      if (existing) return { existing };
      const record = await trx("records").where({ id: args.recordId, company_id: args.companyId }).first("id");
      if (!record) throw new AppError("not_found", "No such record in your company.");
      if (args.shareLinkId !== null) {
        const link = await trx("share_links").where({ id: args.shareLinkId, company_id: args.companyId, record_id: args.recordId }).first("id");
        if (!link) throw new AppError("not_found", "No such share link for this record.");
      }
      const now = nowIso();
      const [inserted] = await trx("email_sends")
        .insert({
          company_id: args.companyId,
          record_id: args.recordId,
          share_link_id: args.shareLinkId,
          idempotency_key: args.idempotencyKey,
          to_address: to,
          subject: args.message.subject.slice(0, 300),
          attach_pdf: attachment !== null,
          status: "sending",
          attempts: 0,
          created_by: args.actor.userId,
          created_at: now,
          updated_at: now,
        })
        .returning("id");
      return { id: insertedId(inserted) };
    });
  } catch (error) {
    // Two first presses at once on a database that lets both reach the insert: the index decides.
    if (!isUniqueViolation(error)) throw error;
    const existing = await findByKey(db, args.companyId, args.idempotencyKey);
    if (!existing) throw error;
    claimed = { existing };
  }
  if ("existing" in claimed) return duplicateOf(claimed.existing);

  const pending: PendingMessage = {
    to,
    message: { subject: args.message.subject, text: args.message.text, html: args.message.html },
    attachment: attachment ? toPendingAttachment(attachment) : null,
  };
  await savePending(args.companyId, claimed.id, pending);
  const emailSend = await deliverAndRecord({ companyId: args.companyId, actor: args.actor, emailSendId: claimed.id, pending, retry: false });
  return { emailSend, duplicate: false };
}

/**
 * Sends a failed e-mail again (also one left 'sending' by an interrupted process). Refused with
 * unprocessable when it was sent or is being sent, or when its share link has expired or was
 * revoked since. The row is claimed with a conditional update, so concurrent retries send once.
 * The kept message is sent unchanged unless the caller passes a newly composed one.
 */
export async function retryEmailSend(args: {
  companyId: number;
  actor: AuditActor;
  emailSendId: number;
  message?: RecordEmailMessage;
  attachment?: RecordEmailAttachment | null;
}): Promise<EmailSend> {
  const db = getDb();
  const row = await db.transaction(async (trx) => {
    const current = await trx("email_sends").where({ id: args.emailSendId, company_id: args.companyId }).first();
    if (!current) throw new AppError("not_found", "No such e-mail in your company.");
    const interrupted = current.status === "sending" && String(current.updated_at) < isoPlus(-STALE_SENDING_MS);
    if (current.status === "sent") throw new AppError("unprocessable", "This e-mail was sent already.");
    if (current.status !== "failed" && !interrupted) throw new AppError("unprocessable", "This e-mail is being sent right now.");
    if (current.share_link_id !== null && current.share_link_id !== undefined) {
      const link = await trx("share_links").where({ id: current.share_link_id, company_id: args.companyId }).first("expires_at", "revoked_at");
      if (!link || link.revoked_at || String(link.expires_at) <= nowIso()) {
        throw new AppError("unprocessable", "The share link in this e-mail has expired or was revoked. Create a new link and send a new e-mail.");
      }
    }
    const claimedRows = await trx("email_sends")
      .where({ id: args.emailSendId, company_id: args.companyId, status: current.status, updated_at: current.updated_at })
      .update({ status: "sending", updated_at: nowIso() });
    if (claimedRows !== 1) throw new AppError("unprocessable", "This e-mail is being sent right now.");
    return current as Row;
  });

  const kept = await loadPending(args.companyId, args.emailSendId);
  let pending: PendingMessage | null = kept;
  if (args.message) {
    const attachment = args.attachment === undefined ? (kept?.attachment ?? null) : args.attachment ? toPendingAttachment(args.attachment) : null;
    pending = { to: row.to_address as string, message: args.message, attachment };
    await db("email_sends")
      .where({ id: args.emailSendId, company_id: args.companyId })
      .update({ subject: args.message.subject.slice(0, 300), attach_pdf: attachment !== null });
    await savePending(args.companyId, args.emailSendId, pending);
  }
  if (!pending) {
    await db("email_sends")
      .where({ id: args.emailSendId, company_id: args.companyId, status: "sending" })
      .update({ status: "failed", last_error: "The message is no longer kept on the server. Send a new e-mail.", updated_at: nowIso() });
    throw new AppError("unprocessable", "This e-mail can no longer be resent. Send a new e-mail from the record.");
  }
  return deliverAndRecord({ companyId: args.companyId, actor: args.actor, emailSendId: args.emailSendId, pending, retry: true });
}

/** One e-mail of the company, or not_found (also for another company's id). */
export async function getEmailSend(args: { companyId: number; id: number }): Promise<EmailSend> {
  const row = await getDb()("email_sends").where({ id: args.id, company_id: args.companyId }).first();
  if (!row) throw new AppError("not_found", "No such e-mail in your company.");
  return toEmailSend(row);
}

/** A record's e-mails, newest first. */
export async function listEmailSends(args: { companyId: number; recordId: number }): Promise<EmailSend[]> {
  const rows = await getDb()("email_sends").where({ company_id: args.companyId, record_id: args.recordId }).orderBy("id", "desc");
  return rows.map(toEmailSend);
}
