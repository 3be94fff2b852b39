import { apiRoute, parseParams } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { readRecordPdf } from "@/lib/data/records";
import { idParamsSchema } from "@/lib/schemas/common";

/** The stored PDF bytes of a record, exactly as signed (any member of the company). */
export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const { record, bytes } = await readRecordPdf({ companyId: member.companyId, recordId: id });
  return new Response(Buffer.from(bytes), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${record.recordNumber}.pdf"`,
      "Content-Length": String(bytes.byteLength),
      "Cache-Control": "private, no-store",
      "X-Content-Type-Options": "nosniff",
    },
  });
});
