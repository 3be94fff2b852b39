"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { SignatureField } from "@/components/signature/signature-field";
import { apiFetch, ApiError } from "@/lib/client/api";
import { EMPTY_SIGNATURE, type SignatureValue } from "@/lib/schemas/signature-values";
import { REVIEW_SECTIONS, REVIEW_SECTION_LABELS, type ReviewSection } from "@/lib/schemas/inspection-values";

interface ReviewData {
  id: number;
  status: string;
  revision: number;
  comments: { id: number; section: ReviewSection; kind: string; body: string; authorName: string; createdAt: string }[];
  installerName: string | null;
  installerSignedName: string | null;
  installerSignaturePng: string | null;
  submittedAt: string | null;
  supervisorName: string | null;
  supervisorSignedName: string | null;
  supervisorSignaturePng: string | null;
  approvedAt: string | null;
  revisions: { id: number; revision: number; status: string; approvedAt: string | null }[];
  justifications: { key: string; title: string; text: string; reference: string }[];
}

function when(iso: string | null) {
  return iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "—";
}

/**
 * The supervisor's side of a submitted inspection: justifications to read, comments per section,
 * return with comments, or approve with a signature confirmed by password. Also shows signatures
 * and revisions once approved.
 */
export function ReviewPanel({ inspection, isReviewer, memberName }: { inspection: ReviewData; isReviewer: boolean; memberName: string }) {
  const router = useRouter();
  const [drafts, setDrafts] = useState<{ section: ReviewSection; body: string }[]>([]);
  const [section, setSection] = useState<ReviewSection>("general");
  const [body, setBody] = useState("");
  const [signature, setSignature] = useState<SignatureValue>({ ...EMPTY_SIGNATURE, typedName: memberName });
  const [password, setPassword] = useState("");
  const [error, setError] = useState<{ text: string; fields?: Record<string, string> } | null>(null);
  const [busy, setBusy] = useState<"return" | "approve" | "revise" | "comment" | null>(null);

  const act = async (kind: "return" | "approve" | "revise" | "comment") => {
    setBusy(kind);
    setError(null);
    try {
      if (kind === "comment") {
        for (const comment of drafts) await apiFetch(`/api/inspections/${inspection.id}/comments`, { method: "POST", body: comment });
        setDrafts([]);
        router.refresh();
      } else if (kind === "return") {
        await apiFetch(`/api/inspections/${inspection.id}/return`, { method: "POST", body: { comments: drafts } });
        setDrafts([]);
        router.refresh();
      } else if (kind === "approve") {
        await apiFetch(`/api/inspections/${inspection.id}/approve`, { method: "POST", body: { signature, password } });
        setPassword("");
        router.refresh();
      } else {
        const result = await apiFetch<{ id: number }>(`/api/inspections/${inspection.id}/revise`, { method: "POST" });
        router.push(`/inspections/${result.id}`);
      }
    } catch (e) {
      setError(e instanceof ApiError ? { text: e.message, fields: e.fields } : { text: "That did not work. Try again." });
    } finally {
      setBusy(null);
    }
  };

  const submitted = inspection.status === "submitted";
  const approved = inspection.status === "approved" || inspection.status === "superseded";

  return (
    <section aria-labelledby="review-title" className="card space-y-4 border-l-4 border-l-copper-500 p-4">
      <h2 id="review-title" className="text-lg font-bold">
        {submitted ? (isReviewer ? "Review" : "Submitted for review") : approved ? "Signed record" : "Read-only"}
      </h2>
      {!isReviewer && submitted ? <p className="text-sm text-ink-600">Your supervisor is reviewing this inspection. It is read-only until they return or approve it.</p> : null}

      <div className="grid gap-4 sm:grid-cols-2">
        {inspection.installerSignedName ? (
          <figure className="space-y-1 text-sm">
            <figcaption className="text-ink-500">Installer</figcaption>
            {inspection.installerSignaturePng ? <img src={inspection.installerSignaturePng} alt={`Signature of ${inspection.installerSignedName}`} className="h-16 rounded border border-ink-200 bg-white" /> : null}
            <p className="font-semibold">{inspection.installerSignedName}</p>
            <p className="text-xs text-ink-500">Submitted {when(inspection.submittedAt)}</p>
          </figure>
        ) : null}
        {inspection.supervisorSignedName ? (
          <figure className="space-y-1 text-sm">
            <figcaption className="text-ink-500">Supervisor</figcaption>
            {inspection.supervisorSignaturePng ? <img src={inspection.supervisorSignaturePng} alt={`Signature of ${inspection.supervisorSignedName}`} className="h-16 rounded border border-ink-200 bg-white" /> : null}
            <p className="font-semibold">{inspection.supervisorSignedName}</p>
            <p className="text-xs text-ink-500">Approved {when(inspection.approvedAt)}</p>
          </figure>
        ) : null}
      </div>

      {inspection.justifications.length > 0 ? (
        <div className="space-y-2">
          <h3 className="text-sm font-bold uppercase tracking-wide text-ink-500">Installer&apos;s justifications</h3>
          <ul className="space-y-2">
            {inspection.justifications.map((j) => (
              <li key={j.key} className="rounded-md bg-warn-soft px-3 py-2 text-sm">
                <p className="font-semibold">{j.title}</p>
                <p>{j.text}</p>
                {j.reference ? <p className="text-xs text-ink-600">Reference: {j.reference}</p> : null}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {inspection.comments.length > 0 ? (
        <div className="space-y-2">
          <h3 className="text-sm font-bold uppercase tracking-wide text-ink-500">Comments</h3>
          <ul className="space-y-1 text-sm">
            {inspection.comments.map((c) => (
              <li key={c.id}>
                <span className="font-medium">{REVIEW_SECTION_LABELS[c.section]}</span>
                {c.kind === "return" ? <span className="text-xs text-copper-700"> (returned)</span> : null}: {c.body}{" "}
                <span className="text-xs text-ink-500">
                  — {c.authorName}, {when(c.createdAt)}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {inspection.revisions.length > 1 ? (
        <div className="space-y-1 text-sm">
          <h3 className="text-sm font-bold uppercase tracking-wide text-ink-500">Revisions</h3>
          <ul className="flex flex-wrap gap-2">
            {inspection.revisions.map((r) => (
              <li key={r.id}>
                <Link href={`/inspections/${r.id}`} className={`rounded-full border px-3 py-1 ${r.id === inspection.id ? "border-copper-500 bg-copper-50" : "border-ink-300"}`}>
                  Revision {r.revision} · {r.status}
                </Link>
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {isReviewer && submitted ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <div className="space-y-2">
            <h3 className="text-base font-bold">Return to the installer</h3>
            <div className="grid gap-2 sm:grid-cols-[10rem_1fr]">
              <div>
                <label htmlFor="comment-section" className="label">
                  Section
                </label>
                <select id="comment-section" className="input" value={section} onChange={(e) => setSection(e.target.value as ReviewSection)}>
                  {REVIEW_SECTIONS.map((s) => (
                    <option key={s} value={s}>
                      {REVIEW_SECTION_LABELS[s]}
                    </option>
                  ))}
                </select>
              </div>
              <div>
                <label htmlFor="comment-body" className="label">
                  Comment
                </label>
                <textarea id="comment-body" rows={2} className="input" value={body} maxLength={2000} onChange={(e) => setBody(e.target.value)} />
              </div>
            </div>
            <button
              type="button"
              className="btn-secondary"
              disabled={!body.trim()}
              onClick={() => {
                setDrafts((d) => [...d, { section, body: body.trim() }]);
                setBody("");
              }}
            >
              Add comment
            </button>
            {drafts.length ? (
              <ul className="list-disc pl-5 text-sm">
                {drafts.map((d, i) => (
                  <li key={i}>
                    {REVIEW_SECTION_LABELS[d.section]}: {d.body}
                  </li>
                ))}
              </ul>
            ) : null}
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-secondary" disabled={drafts.length === 0 || busy !== null} onClick={() => act("return")}>
                {busy === "return" ? "Returning…" : `Return with ${drafts.length} comment${drafts.length === 1 ? "" : "s"}`}
              </button>
              <button type="button" className="btn-ghost" disabled={drafts.length === 0 || busy !== null} onClick={() => act("comment")}>
                {busy === "comment" ? "Posting…" : "Post as notes only"}
              </button>
            </div>
          </div>
          <div className="space-y-2">
            <h3 className="text-base font-bold">Approve and sign</h3>
            <SignatureField value={signature} onChange={setSignature} label="Supervisor's signature" error={error?.fields?.["signature.signaturePng"] ?? error?.fields?.["signature.typedName"]} />
            <div>
              <label htmlFor="approve-password" className="label">
                Your password, to confirm
              </label>
              <input id="approve-password" type="password" autoComplete="current-password" className="input" value={password} onChange={(e) => setPassword(e.target.value)} />
              {error?.fields?.password ? <p className="mt-1 text-sm text-fail">{error.fields.password}</p> : null}
            </div>
            <button type="button" className="btn-primary" disabled={busy !== null || !password || !signature.signaturePng || signature.typedName.trim().length < 2} onClick={() => act("approve")}>
              {busy === "approve" ? "Approving…" : "Approve and sign"}
            </button>
          </div>
        </div>
      ) : null}

      {isReviewer && inspection.status === "approved" ? (
        <div className="space-y-2">
          <p className="text-sm text-ink-600">This inspection is approved and locked. A correction opens a new revision; this one stays readable as it was signed.</p>
          <button type="button" className="btn-secondary" disabled={busy !== null} onClick={() => act("revise")}>
            {busy === "revise" ? "Opening…" : "Correct: open a new revision"}
          </button>
        </div>
      ) : null}

      <div aria-live="assertive">{error ? <p role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{error.text}</p> : null}</div>
    </section>
  );
}
