import { NextResponse } from "next/server";
import { apiRoute } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { openShareLink, readRecordPdf } from "@/lib/data/records";
import { clientAddress } from "@/lib/auth/sign-in";

/** The record's stored PDF for a share-link holder; 410 once the link expired or was revoked. */
export const GET = apiRoute<{ token: string }>(async (request, context) => {
  const { token } = await context.params;
  const opened = await openShareLink({ token, action: "download", client: clientAddress(request.headers), userAgent: request.headers.get("user-agent") ?? "" });
  const { record, bytes } = await readRecordPdf({ companyId: opened.companyId, recordId: opened.recordId });
  if (!bytes.byteLength) throw new AppError("not_found");
  return new NextResponse(Buffer.from(bytes), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${record.recordNumber}.pdf"`,
      "Content-Length": String(bytes.byteLength),
      "Cache-Control": "private, no-store",
      "Referrer-Policy": "no-referrer",
      "X-Content-Type-Options": "nosniff",
    },
  });
});
