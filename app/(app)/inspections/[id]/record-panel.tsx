"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { ErrorState } from "@/components/ui/states";
import { apiFetch, ApiError } from "@/lib/client/api";

interface RecordRow {
  id: number;
  recordNumber: string;
  revision: number;
  verificationCode: string;
  sha256: string;
  pdfBytes: number;
  status: "valid" | "superseded" | "revoked";
  supersededByRevision: number | null;
  revokedReason: string | null;
  approvedAt: string;
}
interface ShareLinkRow {
  id: number;
  recordId: number;
  audience: string;
  label: string;
  expiresAt: string;
  state: "active" | "expired" | "revoked";
  accessCount: number;
  lastAccessAt: string | null;
}
interface EmailRow {
  id: number;
  recordId: number;
  toAddress: string;
  status: "sending" | "sent" | "failed";
  attempts: number;
  lastError: string | null;
  attachPdf: boolean;
  createdAt: string;
}

const STATUS_LABEL = { valid: "Current", superseded: "Superseded", revoked: "Revoked" } as const;

function newKey() {
  return typeof crypto !== "undefined" && "randomUUID" in crypto ? crypto.randomUUID() : `${Date.now()}-${Math.random().toString(36).slice(2)}`;
}

/**
 * The signed record of an approved inspection: download, share links for the homeowner or an
 * inspector, e-mail with the link (and PDF), and revocation — for supervisors and admins.
 */
function RecordPanelView({ inspectionId, canShare, customerEmail }: { inspectionId: number; canShare: boolean; customerEmail: string }) {
  const queryClient = useQueryClient();
  const key = ["record", inspectionId];
  const query = useQuery({ queryKey: key, queryFn: () => apiFetch<{ records: RecordRow[]; shareLinks: ShareLinkRow[]; emails: EmailRow[] }>(`/api/inspections/${inspectionId}/record`) });
  const refresh = () => queryClient.invalidateQueries({ queryKey: key });
  const [audience, setAudience] = useState<"homeowner" | "inspector">("homeowner");
  const [days, setDays] = useState(30);
  const [newLink, setNewLink] = useState<string | null>(null);
  const [to, setTo] = useState(customerEmail);
  const [attachPdf, setAttachPdf] = useState(true);
  const [sendKey, setSendKey] = useState(newKey);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  const current = query.data?.records.find((r) => r.status === "valid") ?? query.data?.records[0];

  const createLink = useMutation({
    mutationFn: () => apiFetch<{ shareLink: { url: string } }>(`/api/records/${current!.id}/share-links`, { method: "POST", body: { audience, expiresInDays: days, label: "" } }),
    onSuccess: (r) => {
      setNewLink(r.shareLink.url);
      void refresh();
    },
    onError: (e) => setMessage({ kind: "error", text: e.message }),
  });
  const revokeLink = useMutation({
    mutationFn: (id: number) => apiFetch(`/api/share-links/${id}`, { method: "DELETE" }),
    onSettled: refresh,
  });
  const send = useMutation({
    mutationFn: () => apiFetch<{ emailSend: EmailRow; duplicate: boolean }>(`/api/records/${current!.id}/email`, { method: "POST", body: { to, audience, expiresInDays: days, attachPdf, idempotencyKey: sendKey } }),
    onSuccess: (r) => {
      setMessage(r.emailSend.status === "sent" ? { kind: "ok", text: `Sent to ${r.emailSend.toAddress}.` } : { kind: "error", text: `Not sent: ${r.emailSend.lastError ?? "the mail server refused it"}. Use Retry below.` });
      setSendKey(newKey());
      void refresh();
    },
    onError: (e) => setMessage({ kind: "error", text: e instanceof ApiError ? Object.values(e.fields)[0] ?? e.message : e.message }),
  });
  const retry = useMutation({
    mutationFn: (id: number) => apiFetch<{ emailSend: EmailRow }>(`/api/email-sends/${id}/retry`, { method: "POST" }),
    onSuccess: (r) => setMessage(r.emailSend.status === "sent" ? { kind: "ok", text: `Sent to ${r.emailSend.toAddress}.` } : { kind: "error", text: `Still not sent: ${r.emailSend.lastError ?? ""}` }),
    onError: (e) => setMessage({ kind: "error", text: e.message }),
    onSettled: refresh,
  });
  const [revokeReason, setRevokeReason] = useState("");
  const revokeRecord = useMutation({
    mutationFn: () => apiFetch(`/api/records/${current!.id}/revoke`, { method: "POST", body: { reason: revokeReason } }),
    onSuccess: () => {
      setRevokeReason("");
      void refresh();
    },
    onError: (e) => setMessage({ kind: "error", text: e instanceof ApiError ? Object.values(e.fields)[0] ?? e.message : e.message }),
  });

  if (query.isPending) return <p className="text-sm text-ink-500">Loading the record…</p>;
  if (query.isError) return <ErrorState title="The record could not be loaded." message={query.error.message} onRetry={() => query.refetch()} />;
  if (!current) return <p className="text-sm text-ink-600">No record has been issued for this inspection.</p>;

  return (
    <section aria-labelledby="record-title" className="card space-y-4 p-4" data-testid="record-panel">
      <h2 id="record-title" className="text-lg font-bold">
        Record PDF and sharing
      </h2>
      <ul className="space-y-2">
        {query.data.records.map((r) => (
          <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-ink-200 px-3 py-2 text-sm">
            <span>
              <span className="font-semibold">
                {r.recordNumber} · revision {r.revision}
              </span>{" "}
              <span className={r.status === "valid" ? "text-pass" : r.status === "revoked" ? "text-fail" : "text-warn"}>
                {STATUS_LABEL[r.status]}
                {r.status === "superseded" && r.supersededByRevision ? ` by revision ${r.supersededByRevision}` : ""}
              </span>
              <span className="block text-xs text-ink-500">
                Code <span className="font-mono" data-testid={`record-code-${r.revision}`}>{r.verificationCode}</span> · SHA-256 <span className="font-mono">{r.sha256.slice(0, 16)}…</span> · {(r.pdfBytes / 1024).toFixed(0)} KB
              </span>
            </span>
            <a className="btn-secondary" href={`/api/records/${r.id}/pdf`} download>
              Download PDF
            </a>
          </li>
        ))}
      </ul>

      {canShare && current.status !== "revoked" ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <div className="space-y-2">
            <h3 className="font-bold">Share with the homeowner or an inspector</h3>
            <div className="grid grid-cols-2 gap-2">
              <div>
                <label htmlFor="share-audience" className="label">
                  For
                </label>
                <select id="share-audience" className="input" value={audience} onChange={(e) => setAudience(e.target.value as "homeowner" | "inspector")}>
                  <option value="homeowner">Homeowner</option>
                  <option value="inspector">Building inspector</option>
                </select>
              </div>
              <div>
                <label htmlFor="share-days" className="label">
                  Open for (days)
                </label>
                <input id="share-days" type="number" inputMode="numeric" min={1} max={90} className="input" value={days} onChange={(e) => setDays(Number(e.target.value))} />
              </div>
            </div>
            <button type="button" className="btn-secondary" disabled={createLink.isPending} onClick={() => createLink.mutate()}>
              Create a share link
            </button>
            {newLink ? (
              <div className="rounded-md bg-pass-soft p-2 text-sm" role="status">
                <p className="font-semibold text-pass">Link created. Copy it now; it is shown only once:</p>
                <p className="select-all break-all font-mono text-xs" data-testid="new-share-link">
                  {newLink}
                </p>
              </div>
            ) : null}
            <h3 className="pt-2 font-bold">E-mail the record</h3>
            <form
              className="space-y-2"
              onSubmit={(e) => {
                e.preventDefault();
                setMessage(null);
                send.mutate();
              }}
            >
              <label htmlFor="email-to" className="label">
                To
              </label>
              <input id="email-to" type="email" inputMode="email" className="input" value={to} onChange={(e) => setTo(e.target.value)} placeholder="homeowner@example.com" />
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" className="h-5 w-5 accent-copper-600" checked={attachPdf} onChange={(e) => setAttachPdf(e.target.checked)} />
                Attach the PDF
              </label>
              <button type="submit" className="btn-primary" disabled={send.isPending || !to}>
                {send.isPending ? "Sending…" : "Send"}
              </button>
            </form>
            <div aria-live="polite">{message ? <p className={`text-sm font-medium ${message.kind === "ok" ? "text-pass" : "text-fail"}`}>{message.text}</p> : null}</div>
          </div>
          <div className="space-y-3">
            <h3 className="font-bold">Links</h3>
            {query.data.shareLinks.length === 0 ? <p className="text-sm text-ink-500">No share links yet.</p> : null}
            <ul className="space-y-1 text-sm">
              {query.data.shareLinks.map((l) => (
                <li key={l.id} className="flex flex-wrap items-center justify-between gap-2">
                  <span>
                    {l.audience} {l.label ? `· ${l.label}` : ""} · <span className={l.state === "active" ? "text-pass" : "text-ink-500"}>{l.state}</span> · until {l.expiresAt.slice(0, 10)} · opened {l.accessCount}×
                  </span>
                  {l.state === "active" ? (
                    <button type="button" className="btn-ghost min-h-0 px-2 py-1 text-fail" onClick={() => revokeLink.mutate(l.id)}>
                      Revoke
                    </button>
                  ) : null}
                </li>
              ))}
            </ul>
            <h3 className="font-bold">E-mails</h3>
            {query.data.emails.length === 0 ? <p className="text-sm text-ink-500">None sent yet.</p> : null}
            <ul className="space-y-1 text-sm" data-testid="email-sends">
              {query.data.emails.map((m) => (
                <li key={m.id} className="flex flex-wrap items-center justify-between gap-2">
                  <span>
                    {m.toAddress} · <span className={m.status === "sent" ? "text-pass" : m.status === "failed" ? "text-fail" : "text-ink-500"}>{m.status}</span>
                    {m.attachPdf ? " · with PDF" : ""} · {m.createdAt.slice(0, 16).replace("T", " ")} UTC{m.lastError && m.status === "failed" ? ` · ${m.lastError}` : ""}
                  </span>
                  {m.status === "failed" ? (
                    <button type="button" className="btn-ghost min-h-0 px-2 py-1" disabled={retry.isPending} onClick={() => retry.mutate(m.id)}>
                      Retry
                    </button>
                  ) : null}
                </li>
              ))}
            </ul>
            <details className="pt-2">
              <summary className="cursor-pointer text-sm font-semibold text-fail">Revoke this record</summary>
              <div className="mt-2 space-y-2">
                <label htmlFor="revoke-reason" className="label">
                  Reason
                </label>
                <input id="revoke-reason" className="input" value={revokeReason} onChange={(e) => setRevokeReason(e.target.value)} maxLength={300} />
                <button type="button" className="btn-danger" disabled={revokeRecord.isPending || revokeReason.trim().length < 5} onClick={() => revokeRecord.mutate()}>
                  Revoke record
                </button>
              </div>
            </details>
          </div>
        </div>
      ) : null}
    </section>
  );
}

export const RecordPanel = withQueryClient(RecordPanelView);
