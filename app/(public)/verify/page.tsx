import type { Metadata } from "next";
import { verifyByCode, type VerificationResult } from "@/lib/data/records";
import { verifyCodeSchema } from "@/lib/schemas/record";
import { UploadCheck } from "./upload-check";

export const metadata: Metadata = { title: "Verify a record", robots: { index: false, follow: false } };

function when(iso?: string | null) {
  return iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "—";
}

function Result({ result, code }: { result: VerificationResult; code: string }) {
  if (!result.found) {
    return (
      <div role="alert" className="rounded-md border-l-4 border-fail bg-fail-soft px-4 py-3" data-testid="verify-result" data-status="unknown">
        <p className="font-bold text-fail">No record has the code {code}</p>
        <p className="text-sm text-ink-800">Check the code on the record (it looks like K7QM-2XDP-9HRA). A record that cannot be found here should not be relied on.</p>
      </div>
    );
  }
  const tone = result.status === "valid" ? "border-pass bg-pass-soft" : result.status === "superseded" ? "border-warn bg-warn-soft" : "border-fail bg-fail-soft";
  const headline =
    result.status === "valid"
      ? "Genuine and current"
      : result.status === "superseded"
        ? `Genuine, but superseded by revision ${result.supersededByRevision ?? result.latestRevision}`
        : "Genuine, but revoked by the company";
  return (
    <div className="space-y-3" data-testid="verify-result" data-status={result.status}>
      <div role="status" className={`rounded-md border-l-4 px-4 py-3 ${tone}`}>
        <p className="text-lg font-bold">{headline}</p>
        <p className="text-sm text-ink-800">
          {result.status === "valid"
            ? "This record was issued by the company named below and no later revision exists."
            : result.status === "superseded"
              ? "A corrected record exists. Ask the company for the latest revision before relying on this one."
              : `The company withdrew this record${result.revokedReason ? `: ${result.revokedReason}` : "."}`}
        </p>
      </div>
      <dl className="card grid gap-x-6 gap-y-2 p-4 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-ink-500">Company</dt>
          <dd className="font-semibold">{result.companyName}</dd>
        </div>
        <div>
          <dt className="text-ink-500">Site</dt>
          <dd className="font-semibold">{result.siteAddress}</dd>
        </div>
        <div>
          <dt className="text-ink-500">Record</dt>
          <dd className="font-semibold">
            {result.recordNumber}, revision {result.revision} of {result.latestRevision}
          </dd>
        </div>
        <div>
          <dt className="text-ink-500">Submitted by the installer</dt>
          <dd className="font-semibold">
            {result.installerName}, {when(result.submittedAt)}
          </dd>
        </div>
        <div>
          <dt className="text-ink-500">Approved and signed</dt>
          <dd className="font-semibold">
            {result.supervisorName}, {when(result.approvedAt)}
          </dd>
        </div>
        {result.revokedAt ? (
          <div>
            <dt className="text-ink-500">Revoked</dt>
            <dd className="font-semibold">{when(result.revokedAt)}</dd>
          </div>
        ) : null}
        <div className="sm:col-span-2">
          <dt className="text-ink-500">SHA-256 of the signed PDF</dt>
          <dd className="break-all font-mono text-xs" data-testid="verify-sha">
            {result.sha256}
          </dd>
        </div>
      </dl>
    </div>
  );
}

export default async function VerifyPage({ searchParams }: { searchParams: Promise<{ code?: string }> }) {
  const raw = (await searchParams).code ?? "";
  const parsed = raw ? verifyCodeSchema.safeParse({ code: raw }) : null;
  const result = parsed?.success ? await verifyByCode(parsed.data.code) : null;
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Verify an inspection record</h1>
        <p className="text-ink-700">Enter the verification code printed on the record (or scan its QR code) to see whether it is genuine and current. You can also check a PDF file itself.</p>
      </div>
      <form method="get" action="/verify" className="card flex flex-wrap items-end gap-3 p-4">
        <div className="min-w-[14rem] flex-1">
          <label htmlFor="code" className="label">
            Verification code
          </label>
          <input id="code" name="code" className="input font-mono uppercase" defaultValue={raw} placeholder="K7QM-2XDP-9HRA" maxLength={40} autoComplete="off" autoCapitalize="characters" />
          {parsed && !parsed.success ? <p className="mt-1 text-sm text-fail">{parsed.error.issues[0]?.message}</p> : null}
        </div>
        <button type="submit" className="btn-primary">
          Check the code
        </button>
      </form>
      {result && parsed?.success ? <Result result={result} code={parsed.data.code} /> : null}
      <UploadCheck code={parsed?.success ? parsed.data.code : ""} />
    </div>
  );
}
