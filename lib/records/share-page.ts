import { escapeHtml } from "@/lib/mail/record-email";
import { SAFETY_NOTICE_SHORT } from "@/components/safety-notice";
import type { SharedRecordView } from "@/lib/data/records";

/**
 * The public page of a share link, as plain HTML: it must answer 410 for an expired or revoked
 * link, which a route handler can and a page cannot. No script, nothing of the company beyond
 * the record's summary.
 */
const STYLE = `
*{box-sizing:border-box}body{margin:0;font-family:system-ui,-apple-system,"Segoe UI",sans-serif;background:#f5f7f8;color:#1a2126;line-height:1.45}
header{background:#1a2126;color:#fff;padding:12px 16px}header .in{max-width:720px;margin:0 auto;display:flex;justify-content:space-between;align-items:center}
header a{color:#cfd8dc;text-decoration:none;font-size:14px}main{max-width:720px;margin:0 auto;padding:24px 16px}
.kicker{color:#a74f22;font-weight:700;text-transform:uppercase;letter-spacing:.04em;font-size:13px;margin:0}
h1{font-size:24px;margin:4px 0 4px}.status{border-left:4px solid;padding:10px 14px;border-radius:6px;margin:18px 0}
.valid{border-color:#1f7a4d;background:#e3f4ea}.superseded{border-color:#8a5a00;background:#fdf1d8}.revoked,.gone{border-color:#b3261e;background:#fbe7e5}
.card{background:#fff;border:1px solid #cfd8dc;border-radius:8px;padding:16px}dl{display:grid;grid-template-columns:1fr 1fr;gap:10px 24px;margin:0}
dt{color:#5c727c;font-size:13px}dd{margin:0;font-weight:600}.mono{font-family:ui-monospace,monospace;word-break:break-all;font-size:12px;font-weight:400}
.wide{grid-column:1/-1}.actions{display:flex;flex-wrap:wrap;gap:12px;margin:18px 0}.btn{display:inline-block;padding:12px 16px;border-radius:6px;font-weight:700;text-decoration:none}
.primary{background:#a74f22;color:#fff}.secondary{background:#fff;color:#283239;border:1px solid #a9b8bf}.caution{border-left:4px solid #8a5a00;background:#fdf1d8;padding:10px 14px;border-radius:6px;font-size:14px}
.small{font-size:12px;color:#5c727c}@media(max-width:480px){dl{grid-template-columns:1fr}}`;

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><meta name="robots" content="noindex,nofollow"><meta name="referrer" content="no-referrer"><title>${escapeHtml(title)} · Flueward</title><style>${STYLE}</style></head><body><header><div class="in"><strong>Flueward · record check</strong><a href="/verify">Verify a record</a></div></header><main>${body}<p class="caution">${escapeHtml(SAFETY_NOTICE_SHORT)} If you smell gas or a CO alarm sounds, leave the home and call the gas emergency number from outside.</p></main></body></html>`;
}

const STATUS = {
  valid: ["Current record", "This is the current, signed version of the record."],
  superseded: ["Superseded", "A corrected revision of this record exists. Ask the company for the current one."],
  revoked: ["Revoked", "The company has withdrawn this record. Do not rely on it."],
} as const;

export function sharedRecordHtml(token: string, view: SharedRecordView): string {
  const [title, text] = STATUS[view.status];
  const when = (iso: string) => `${escapeHtml(iso.slice(0, 16).replace("T", " "))} UTC`;
  const superseded = view.status === "superseded" && view.supersededByRevision ? ` (revision ${view.supersededByRevision})` : "";
  return page(
    "Inspection record",
    `<p class="kicker">${escapeHtml(view.companyName)}</p><h1>Venting and combustion-air inspection record</h1><p>${escapeHtml(view.siteAddress)}</p>
<div class="status ${view.status}" role="status"><strong>${title}</strong><br>${text}${superseded}</div>
<div class="card"><dl>
<div><dt>Record</dt><dd>${escapeHtml(view.recordNumber)}, revision ${view.revision}</dd></div>
<div><dt>Approved</dt><dd>${when(view.approvedAt)}</dd></div>
<div><dt>Installer</dt><dd>${escapeHtml(view.installerName)}</dd></div>
<div><dt>Signed off by</dt><dd>${escapeHtml(view.supervisorName)}</dd></div>
<div><dt>Verification code</dt><dd data-testid="share-code">${escapeHtml(view.verificationCode)}</dd></div>
<div class="wide"><dt>SHA-256 of the PDF</dt><dd class="mono">${escapeHtml(view.sha256)}</dd></div>
</dl></div>
<div class="actions"><a class="btn primary" href="/share/${encodeURIComponent(token)}/pdf">Download the PDF record</a><a class="btn secondary" href="/verify?code=${encodeURIComponent(view.verificationCode)}">Check it is genuine</a></div>
<p class="small">This link works until ${escapeHtml(view.expiresAt.slice(0, 10))}.</p>`,
  );
}

export function shareProblemHtml(kind: "gone" | "not_found", message: string): string {
  return page(
    kind === "gone" ? "Link no longer available" : "Link not valid",
    `<h1>${kind === "gone" ? "This link is no longer available" : "This link is not valid"}</h1><div class="status gone" role="alert">${escapeHtml(message)}</div><p>If you have the PDF already, you can still check it on the <a href="/verify">verification page</a>.</p>`,
  );
}
