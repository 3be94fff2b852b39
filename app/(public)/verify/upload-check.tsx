"use client";

import { useState } from "react";
import { useHydrated } from "@/components/ui/use-hydrated";

interface Answer {
  sha256: string;
  matches: boolean;
  record: { found: boolean; recordNumber?: string; revision?: number; status?: string; sha256?: string };
}

/** Checks a PDF file's bytes against the stored hash: any changed byte makes it not match. */
export function UploadCheck({ code }: { code: string }) {
  const [answer, setAnswer] = useState<Answer | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  // Until the script runs the button stays disabled: the browser would otherwise send the form
  // itself, reloading the page without the answer.
  const ready = useHydrated();
  return (
    <form
      method="post"
      encType="multipart/form-data"
      className="card space-y-3 p-4"
      onSubmit={async (e) => {
        e.preventDefault();
        setError(null);
        setAnswer(null);
        const data = new FormData(e.currentTarget);
        const file = data.get("file");
        if (!(file instanceof File) || file.size === 0) return setError("Choose the PDF file to check.");
        setBusy(true);
        try {
          const response = await fetch("/api/verify", { method: "POST", body: data });
          const body = await response.json();
          if (!response.ok) setError(body?.error?.fields?.file ?? body?.error?.message ?? "The file could not be checked.");
          else setAnswer(body as Answer);
        } catch {
          setError("Could not reach the server. Try again.");
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 className="text-lg font-bold">Check a PDF file</h2>
      <p className="text-sm text-ink-600">The file is sent only to work out its fingerprint (SHA-256), which is compared with the one stored when the record was signed; the file itself is not kept.</p>
      <input type="hidden" name="code" value={code} />
      <label htmlFor="verify-file" className="label">
        Record PDF
      </label>
      <input id="verify-file" name="file" type="file" accept="application/pdf,.pdf" className="block w-full text-sm" />
      <button type="submit" className="btn-secondary" disabled={!ready || busy}>
        {busy ? "Checking…" : "Check the file"}
      </button>
      <div aria-live="polite">
        {error ? <p className="text-sm font-medium text-fail">{error}</p> : null}
        {answer ? (
          answer.matches ? (
            <p className="rounded-md border-l-4 border-pass bg-pass-soft px-3 py-2 text-sm" data-testid="upload-result" data-matches="true">
              <span className="font-bold">The file matches</span> record {answer.record.recordNumber}, revision {answer.record.revision}
              {answer.record.status !== "valid" ? ` — note: that record is ${answer.record.status}` : ""}. It is byte for byte the signed record.
            </p>
          ) : (
            <p className="rounded-md border-l-4 border-fail bg-fail-soft px-3 py-2 text-sm" data-testid="upload-result" data-matches="false">
              <span className="font-bold">The file does not match</span>
              {code ? ` the record with code ${code}` : " any signed record"}. It may have been changed after signing, or it is a different document. Its SHA-256 is{" "}
              <span className="break-all font-mono text-xs">{answer.sha256}</span>.
            </p>
          )
        ) : null}
      </div>
    </form>
  );
}
