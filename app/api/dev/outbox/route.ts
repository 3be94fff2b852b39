import { apiRoute, json, parseQuery } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { listOutboxMessages, outboxEnabled, outboxQuerySchema } from "@/lib/mail/outbox";

/**
 * The development outbox as JSON, newest first, for the end-to-end tests: what the local fake
 * SMTP server received. Answers 404 in production unless FLUEWARD_DEV_OUTBOX=1.
 */
export const dynamic = "force-dynamic";

export const GET = apiRoute(async (request) => {
  if (!outboxEnabled()) throw new AppError("not_found");
  await requireMember();
  const query = parseQuery(request, outboxQuerySchema);
  return json({ messages: await listOutboxMessages({ limit: query.limit, to: query.to || undefined }) });
});
