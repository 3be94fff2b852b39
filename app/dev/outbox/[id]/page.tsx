import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageMember } from "@/lib/auth/session";
import { getOutboxMessage, outboxEnabled } from "@/lib/mail/outbox";
import { formatBytes, formatReceivedAt } from "../format";

export const metadata = { title: "Development outbox" };
export const dynamic = "force-dynamic";

export default async function DevOutboxMessagePage({ params }: { params: Promise<{ id: string }> }) {
  if (!outboxEnabled()) notFound();
  await requirePageMember();
  const message = await getOutboxMessage((await params).id);
  if (!message) notFound();

  const headerRows: [string, string][] = [
    ["From", message.from],
    ["To", message.to.join(", ")],
    ["Received", formatReceivedAt(message.receivedAt)],
    ["Message-ID", message.messageId],
  ];

  return (
    <>
      <nav className="text-sm text-ink-500">
        <Link href="/dev/outbox" className="hover:underline">
          Outbox
        </Link>{" "}
        / <span className="font-mono">{message.id}</span>
      </nav>
      <h1 className="text-2xl font-bold tracking-tight" data-testid="outbox-subject">
        {message.subject || "(no subject)"}
      </h1>

      <section className="card p-4" aria-labelledby="outbox-headers">
        <h2 id="outbox-headers" className="sr-only">
          Headers
        </h2>
        <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[8rem_1fr]">
          {headerRows.map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="font-medium text-ink-600">{label}</dt>
              <dd className="break-all text-ink-900">{value || "—"}</dd>
            </div>
          ))}
        </dl>
      </section>

      <section className="card p-4" aria-labelledby="outbox-links">
        <h2 id="outbox-links" className="mb-2 font-bold">
          Links
        </h2>
        {message.links.length === 0 ? (
          <p className="text-sm text-ink-600">This e-mail has no links.</p>
        ) : (
          <ul className="space-y-1 text-sm" data-testid="outbox-links">
            {message.links.map((link) => (
              <li key={link}>
                <a href={link} rel="noreferrer" className="break-all text-copper-700 underline hover:text-copper-800">
                  {link}
                </a>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section className="card p-4" aria-labelledby="outbox-attachments">
        <h2 id="outbox-attachments" className="mb-2 font-bold">
          Attachments
        </h2>
        {message.attachments.length === 0 ? (
          <p className="text-sm text-ink-600">No attachments.</p>
        ) : (
          <table className="w-full text-left text-sm" data-testid="outbox-attachments">
            <thead className="text-ink-600">
              <tr>
                <th className="py-1 pr-3 font-medium">File</th>
                <th className="py-1 pr-3 font-medium">Type</th>
                <th className="py-1 pr-3 font-medium">Size</th>
                <th className="py-1 font-medium">SHA-256</th>
              </tr>
            </thead>
            <tbody>
              {message.attachments.map((attachment, index) => (
                <tr key={`${attachment.sha256}-${index}`} className="border-t border-ink-100">
                  <td className="break-all py-1 pr-3">{attachment.filename || "(unnamed)"}</td>
                  <td className="py-1 pr-3">{attachment.contentType}</td>
                  <td className="whitespace-nowrap py-1 pr-3">{formatBytes(attachment.size)}</td>
                  <td className="py-1 font-mono text-xs" title={attachment.sha256}>
                    {attachment.sha256.slice(0, 16)}…
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>

      <section className="card p-4" aria-labelledby="outbox-text">
        <h2 id="outbox-text" className="mb-2 font-bold">
          Text
        </h2>
        <pre className="whitespace-pre-wrap break-words font-sans text-sm text-ink-900" data-testid="outbox-text">
          {message.text || "(no text part)"}
        </pre>
      </section>

      {message.html ? (
        <details className="card p-4">
          <summary className="cursor-pointer font-bold">HTML part (source)</summary>
          {/* Shown as text only: the HTML part is never rendered in the app's own page. */}
          <pre className="mt-2 max-h-96 overflow-auto whitespace-pre-wrap break-all font-mono text-xs text-ink-700">{message.html}</pre>
        </details>
      ) : null}
    </>
  );
}
