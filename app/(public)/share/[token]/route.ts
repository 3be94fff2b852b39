import { AppError } from "@/lib/errors";
import { openShareLink } from "@/lib/data/records";
import { clientAddress } from "@/lib/auth/sign-in";
import { sharedRecordHtml, shareProblemHtml } from "@/lib/records/share-page";

const HEADERS = {
  "Content-Type": "text/html; charset=utf-8",
  "Cache-Control": "private, no-store",
  "Referrer-Policy": "no-referrer",
  "X-Robots-Tag": "noindex, nofollow",
  // No script at all on this page; styles are inline in the document.
  "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; form-action 'none'; frame-ancestors 'none'; base-uri 'none'",
};

/** A share link's public page: 200 with the record summary, 410 expired or revoked, 404 unknown. */
export async function GET(request: Request, context: { params: Promise<{ token: string }> }) {
  const { token } = await context.params;
  try {
    const { view } = await openShareLink({ token, action: "view", client: clientAddress(request.headers), userAgent: request.headers.get("user-agent") ?? "" });
    return new Response(sharedRecordHtml(token, view), { status: 200, headers: HEADERS });
  } catch (error) {
    if (error instanceof AppError && (error.code === "gone" || error.code === "not_found")) {
      return new Response(shareProblemHtml(error.code, error.message), { status: error.status, headers: HEADERS });
    }
    console.error("[share] could not open a share link", error);
    return new Response(shareProblemHtml("not_found", "The record could not be shown just now. Try again in a moment."), { status: 500, headers: HEADERS });
  }
}
