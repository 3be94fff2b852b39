import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageMember } from "@/lib/auth/session";
import { listOutbox, outboxEnabled } from "@/lib/mail/outbox";
import { formatReceivedAt } from "./format";

export const metadata = { title: "Development outbox" };
export const dynamic = "force-dynamic";

export default async function DevOutboxPage() {
  if (!outboxEnabled()) notFound();
  await requirePageMember();
  const messages = await listOutbox({ limit: 100 });

  return (
    <>
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Development outbox</h1>
        <p className="text-sm text-ink-600">
          E-mails the local fake mail server received, newest first. Nothing shown here left this machine. This page does not exist in production.
        </p>
      </div>
      {messages.length === 0 ? (
        <div className="card p-6 text-ink-600" data-testid="outbox-empty">
          No e-mails yet. Send a record from an approved inspection and it appears here.
        </div>
      ) : (
        <ul className="card divide-y divide-ink-200" aria-label="Received e-mails" data-testid="outbox-list">
          {messages.map((message) => (
            <li key={message.id}>
              <Link href={`/dev/outbox/${message.id}`} className="block px-4 py-3 hover:bg-ink-50" data-testid="outbox-item">
                <span className="block font-semibold text-ink-900">{message.subject || "(no subject)"}</span>
                <span className="mt-0.5 flex flex-wrap gap-x-4 text-sm text-ink-600">
                  <span>To {message.to.join(", ") || "(nobody)"}</span>
                  <time dateTime={message.receivedAt}>{formatReceivedAt(message.receivedAt)}</time>
                  {message.attachmentCount > 0 ? <span>{message.attachmentCount === 1 ? "1 attachment" : `${message.attachmentCount} attachments`}</span> : null}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
