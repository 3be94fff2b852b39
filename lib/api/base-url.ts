/**
 * The address people outside the company use to reach this server (printed in the PDF's QR code
 * and in share links). PUBLIC_BASE_URL wins; otherwise the request's own origin.
 */
export function publicBaseUrl(request: { headers: Headers; nextUrl?: { origin: string } }): string {
  const configured = process.env.PUBLIC_BASE_URL?.trim();
  if (configured) return configured.replace(/\/$/, "");
  const host = request.headers.get("x-forwarded-host") ?? request.headers.get("host");
  const proto = request.headers.get("x-forwarded-proto") ?? (request.nextUrl?.origin.startsWith("https") ? "https" : "http");
  return host ? `${proto}://${host}` : (request.nextUrl?.origin ?? "http://localhost:3000");
}
