import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { publicBaseUrl } from "@/lib/api/base-url";
import { createShareLink } from "@/lib/data/records";
import { idParamsSchema } from "@/lib/schemas/common";
import { shareLinkCreateSchema } from "@/lib/schemas/record";

/** A new share link; the URL (with its token) is in this answer only. */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("records.share");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, shareLinkCreateSchema, 10_000);
  const link = await createShareLink({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, recordId: id, baseUrl: publicBaseUrl(request), ...input });
  return json({ shareLink: link }, { status: 201 });
});
