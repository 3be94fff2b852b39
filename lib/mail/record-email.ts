/**
 * The e-mail that takes a signed record to a homeowner or an inspector: a plain-text part and a
 * simple HTML part saying the same thing, with the share link, its expiry, the verification
 * code and the caution. Pure: no I/O, every interpolated value escaped in the HTML.
 */
export type RecordEmailAudience = "homeowner" | "inspector";

export interface RecordEmailInput {
  companyName: string;
  /** How to reach the company about the work; empty parts are left out. */
  companyPhone?: string;
  companyEmail?: string;
  siteAddress: string;
  audience: RecordEmailAudience;
  /** The recipient's name for the greeting, if known. */
  recipientName?: string;
  /** Human-facing record number, e.g. "R-000042". */
  recordNumber: string;
  revision: number;
  /** ISO timestamp of the supervisor's sign-off. */
  approvedAt: string;
  /** The share link (with its token). */
  shareUrl: string;
  /** ISO timestamp after which the share link stops working. */
  linkExpiresAt: string;
  verificationCode: string;
  /** The verification page with the code filled in. */
  verifyUrl: string;
  /** Whether the PDF travels with the message as an attachment. */
  pdfAttached: boolean;
  /** IANA time zone for the dates in the message; UTC when not given. */
  timeZone?: string;
}

export interface ComposedEmail {
  subject: string;
  text: string;
  html: string;
}

export interface EmailAttachment {
  filename: string;
  contentType: string;
  content: Uint8Array;
}

export const RECORD_EMAIL_SUBJECT_MAX = 300;

export const CAUTION_GOVERNS =
  "The locally adopted code, the authority having jurisdiction and the appliance manufacturer's installation instructions govern.";
export const CAUTION_NOT_AN_INSPECTION = "is not a substitute for an inspection by a licensed professional or the building authority.";
export const CAUTION_EMERGENCY =
  "If you smell gas or a carbon monoxide (CO) alarm sounds, leave the home at once and call the gas emergency number from outside.";

export const INVALID_URL_MESSAGE = "Record e-mail links must be absolute http(s) URLs.";

/** The caution paragraph, worded for the company that sent the record. */
export function recordEmailCaution(companyName: string): string {
  return `${CAUTION_GOVERNS} This record reports the checks ${oneLine(companyName)} made against its own stated tables; it ${CAUTION_NOT_AN_INSPECTION} ${CAUTION_EMERGENCY}`;
}

/** Escapes text for HTML element content and quoted attribute values. */
export function escapeHtml(value: string): string {
  return value.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

/** Collapses line breaks and runs of space: headers and one-line values never carry a newline. */
function oneLine(value: string): string {
  return value.replace(/[\r\n\t]+/g, " ").replace(/\s{2,}/g, " ").trim();
}

function assertHttpUrl(value: string): string {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw new Error(INVALID_URL_MESSAGE);
  }
  if (url.protocol !== "https:" && url.protocol !== "http:") throw new Error(INVALID_URL_MESSAGE);
  return url.toString();
}

function formatDate(iso: string, timeZone: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return new Intl.DateTimeFormat("en-US", { dateStyle: "long", timeZone }).format(date);
}

/** "Your inspection record from <company> — <site address>", on one line, at most 300 characters. */
export function recordEmailSubject(companyName: string, siteAddress: string): string {
  const subject = `Your inspection record from ${oneLine(companyName)} — ${oneLine(siteAddress)}`;
  return subject.length > RECORD_EMAIL_SUBJECT_MAX ? `${subject.slice(0, RECORD_EMAIL_SUBJECT_MAX - 1)}…` : subject;
}

/** File name for the attached PDF, e.g. "flueward-record-R-000042-rev2.pdf". */
export function recordPdfFilename(recordNumber: string, revision: number): string {
  const safe = recordNumber.replace(/[^A-Za-z0-9-]+/g, "-").replace(/^-+|-+$/g, "") || "record";
  return `flueward-record-${safe}-rev${revision}.pdf`;
}

/** The PDF as an attachment for `sendRecordEmail`. */
export function recordPdfAttachment(args: { recordNumber: string; revision: number; bytes: Uint8Array }): EmailAttachment {
  return { filename: recordPdfFilename(args.recordNumber, args.revision), contentType: "application/pdf", content: args.bytes };
}

/** Composes the subject, text and HTML of the record e-mail. Throws when a link is not an http(s) URL. */
export function composeRecordEmail(input: RecordEmailInput): ComposedEmail {
  const timeZone = input.timeZone ?? "UTC";
  const company = oneLine(input.companyName);
  const site = oneLine(input.siteAddress);
  const shareUrl = assertHttpUrl(input.shareUrl);
  const verifyUrl = assertHttpUrl(input.verifyUrl);
  const verifyPage = new URL(verifyUrl);
  verifyPage.search = "";
  verifyPage.hash = "";
  const verifyPageUrl = verifyPage.toString();
  const code = oneLine(input.verificationCode);
  const recordNumber = oneLine(input.recordNumber);
  const expires = formatDate(input.linkExpiresAt, timeZone);
  const approved = formatDate(input.approvedAt, timeZone);
  const greetingName = input.recipientName ? oneLine(input.recipientName) : "";
  const contact = [input.companyPhone, input.companyEmail].map((part) => (part ? oneLine(part) : "")).filter(Boolean);

  const intro =
    input.audience === "inspector"
      ? `${company} has shared the signed inspection record for the gas appliance venting and combustion air at ${site} for your review.`
      : `${company} has shared the signed record of the inspection of your gas appliance venting and combustion air at ${site}.`;
  const what = `This is record ${recordNumber}, revision ${input.revision}, signed off by a supervisor on ${approved}. It lists what was checked on site, the measured and required values with their sources, the readings taken, and who signed it.`;
  const linkLine = `The link works until ${expires}. After that, ask ${company} for a new one.`;
  const pdfLine = input.pdfAttached ? "A copy of the record is attached to this e-mail as a PDF." : "";
  const verifyLine = `To check that a copy of the record is genuine and current, open the verification page and enter the code ${code}, or upload the PDF there.`;
  const caution = recordEmailCaution(company);
  const contactLine = contact.length ? `Questions about the work: ${company}, ${contact.join(", ")}.` : `Questions about the work: contact ${company}.`;

  const text = [
    greetingName ? `Hello ${greetingName},` : "Hello,",
    "",
    intro,
    "",
    what,
    "",
    "Open the record:",
    shareUrl,
    linkLine,
    ...(pdfLine ? [pdfLine] : []),
    "",
    verifyLine,
    `Verification code: ${code}`,
    `Verify: ${verifyUrl}`,
    `Verification page: ${verifyPageUrl}`,
    "",
    `Caution: ${caution}`,
    "",
    contactLine,
    "",
    `Sent by Flueward on behalf of ${company}.`,
    "",
  ].join("\n");

  const e = escapeHtml;
  const p = (content: string) => `<p style="margin:0 0 12px 0">${content}</p>`;
  const html = [
    "<!doctype html>",
    '<html lang="en"><head><meta charset="utf-8"><title>' + e(recordEmailSubject(company, site)) + "</title></head>",
    '<body style="margin:0;padding:16px;font-family:Arial,Helvetica,sans-serif;font-size:15px;line-height:1.5;color:#1f2933;background:#ffffff">',
    '<div style="max-width:600px">',
    p(greetingName ? `Hello ${e(greetingName)},` : "Hello,"),
    p(e(intro)),
    p(e(what)),
    p(`<a href="${e(shareUrl)}" style="color:#9a4a12;font-weight:bold">Open the inspection record</a><br><span style="font-size:13px;color:#52606d">${e(shareUrl)}</span>`),
    p(e(linkLine) + (pdfLine ? `<br>${e(pdfLine)}` : "")),
    p(
      `${e(verifyLine)}<br>Verification code: <strong style="font-family:Consolas,monospace;letter-spacing:1px">${e(code)}</strong><br>` +
        `<a href="${e(verifyUrl)}" style="color:#9a4a12">Verify this record</a> (page: <a href="${e(verifyPageUrl)}" style="color:#9a4a12">${e(verifyPageUrl)}</a>)`,
    ),
    `<div style="margin:16px 0;padding:12px;border-left:4px solid #b7791f;background:#fdf6e3"><p style="margin:0 0 4px 0;font-weight:bold">Caution</p><p style="margin:0">${e(caution)}</p></div>`,
    p(e(contactLine)),
    `<p style="margin:0;font-size:12px;color:#52606d">Sent by Flueward on behalf of ${e(company)}.</p>`,
    "</div></body></html>",
  ].join("\n");

  return { subject: recordEmailSubject(company, site), text, html };
}
