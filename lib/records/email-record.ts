import "server-only";
import { AppError } from "@/lib/errors";
import { composeRecordEmail, recordPdfAttachment } from "@/lib/mail/record-email";
import { sendRecordEmail, retryEmailSend } from "@/lib/data/email-sends";
import { createShareLink, emailKeyUsed, readRecordPdf, recordEmailFacts, type ShareAudience } from "@/lib/data/records";
import type { AuditActor } from "@/lib/data/audit";

/**
 * Sends a record to a homeowner or inspector: a new share link, the composed message and, when
 * asked, the PDF. The idempotency key makes a double click send one e-mail and make one link.
 */
export async function emailRecord(args: {
  companyId: number;
  actor: AuditActor;
  recordId: number;
  to: string;
  audience: ShareAudience;
  expiresInDays: number;
  attachPdf: boolean;
  idempotencyKey: string;
  baseUrl: string;
}) {
  const facts = await recordEmailFacts({ companyId: args.companyId, recordId: args.recordId });
  if (facts.status === "revoked") throw new AppError("unprocessable", "This record is revoked and cannot be sent.");
  if (await emailKeyUsed({ companyId: args.companyId, idempotencyKey: args.idempotencyKey })) {
    return sendRecordEmail({ companyId: args.companyId, actor: args.actor, recordId: args.recordId, shareLinkId: null, to: args.to, idempotencyKey: args.idempotencyKey, message: { subject: "(already sent)", text: "", html: "" } });
  }
  const link = await createShareLink({
    companyId: args.companyId,
    actor: args.actor,
    recordId: args.recordId,
    audience: args.audience,
    expiresInDays: args.expiresInDays,
    label: `E-mailed to ${args.to}`,
    baseUrl: args.baseUrl,
  });
  const base = args.baseUrl.replace(/\/$/, "");
  const message = composeRecordEmail({
    companyName: facts.companyName,
    companyPhone: facts.companyPhone,
    companyEmail: facts.companyEmail,
    siteAddress: facts.siteAddress,
    audience: args.audience,
    recordNumber: facts.recordNumber,
    revision: facts.revision,
    approvedAt: facts.approvedAt,
    shareUrl: link.url,
    linkExpiresAt: link.expiresAt,
    verificationCode: facts.verificationCode,
    verifyUrl: `${base}/verify?code=${encodeURIComponent(facts.verificationCode)}`,
    pdfAttached: args.attachPdf,
  });
  const attachment = args.attachPdf
    ? recordPdfAttachment({ recordNumber: facts.recordNumber, revision: facts.revision, bytes: (await readRecordPdf({ companyId: args.companyId, recordId: args.recordId })).bytes })
    : null;
  return sendRecordEmail({ companyId: args.companyId, actor: args.actor, recordId: args.recordId, shareLinkId: link.id, to: args.to, idempotencyKey: args.idempotencyKey, message, attachment });
}

export async function retryRecordEmail(args: { companyId: number; actor: AuditActor; emailSendId: number }) {
  return retryEmailSend(args);
}
