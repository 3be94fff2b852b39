import { apiRoute, json, parseParams } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { getInspectionAccess } from "@/lib/data/inspection-access";
import { listRecordsForInspection, listShareLinks } from "@/lib/data/records";
import { listEmailSends } from "@/lib/data/email-sends";
import { idParamsSchema } from "@/lib/schemas/common";

/** The records of an inspection's revisions, with share links and e-mails for those who manage them. */
export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  await getInspectionAccess({ companyId: member.companyId, inspectionId: id });
  const records = await listRecordsForInspection({ companyId: member.companyId, inspectionId: id });
  const manage = can(member.role, "records.share");
  const shareLinks = manage ? await listShareLinks({ companyId: member.companyId, recordIds: records.map((r) => r.id) }) : [];
  const emails = manage ? (await Promise.all(records.map((r) => listEmailSends({ companyId: member.companyId, recordId: r.id })))).flat() : [];
  return json({ records, shareLinks, emails });
});
