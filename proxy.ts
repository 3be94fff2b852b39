import { NextResponse, type NextRequest } from "next/server";
import path from "node:path";
import { buildCsp, readPrerenderedPageHashes } from "@/lib/api/csp";
import { isCrossSiteWrite } from "@/lib/api/origin";

/**
 * Runs before every request: a CSP for pages (a fresh nonce, or for a page the build prerendered
 * the hashes of its inline scripts: lib/api/csp.ts), security headers for everything,
 * cross-site writes refused, and an early redirect to sign-in for pages when no session cookie
 * is present. The redirect is only a convenience: every handler, action and data read checks
 * the session and the role itself.
 */
const PUBLIC_PAGE_PREFIXES = ["/sign-in", "/verify", "/share", "/forbidden"];

const dev = process.env.NODE_ENV !== "production";

/** The pages the production build prerendered, with their inline scripts' hashes; read once. */
let prerenderedPages: Map<string, string[]> | undefined;
function prerenderedPageHashes(pathname: string): string[] | undefined {
  if (dev) return undefined; // the dev server renders every page per request, with the nonce
  prerenderedPages ??= readPrerenderedPageHashes(path.join(/* turbopackIgnore: true */ process.cwd(), ".next"));
  return prerenderedPages.get(pathname);
}

function applySecurityHeaders(response: NextResponse, csp: string): NextResponse {
  response.headers.set("Content-Security-Policy", csp);
  response.headers.set("X-Content-Type-Options", "nosniff");
  response.headers.set("Referrer-Policy", "strict-origin-when-cross-origin");
  response.headers.set("X-Frame-Options", "DENY");
  response.headers.set("Permissions-Policy", "camera=(self), geolocation=(), microphone=()");
  response.headers.set("Cross-Origin-Opener-Policy", "same-origin");
  if (process.env.NODE_ENV === "production" && process.env.COOKIE_SECURE !== "false") {
    response.headers.set("Strict-Transport-Security", "max-age=31536000; includeSubDomains");
  }
  return response;
}

function hasSessionCookie(request: NextRequest): boolean {
  return request.cookies.has("__Host-flueward-session") || request.cookies.has("flueward-session");
}

export async function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;

  if (pathname.startsWith("/api/")) {
    // Nothing under /api is a document: sandbox it too, so a photo or PDF opened directly can
    // never run anything (this header replaces any CSP the handler set).
    const csp = "default-src 'none'; frame-ancestors 'none'; sandbox";
    if (isCrossSiteWrite(request)) {
      const refused = NextResponse.json(
        { error: { code: "cross_site_refused", message: "This request came from another site and was refused." } },
        { status: 403 },
      );
      return applySecurityHeaders(refused, csp);
    }
    return applySecurityHeaders(NextResponse.next(), csp);
  }

  // Only a GET is answered with the prerendered HTML: Next renders a POST (a sign-in form sent
  // before its script ran) per request, and that render takes the nonce.
  const hashes = request.method === "GET" || request.method === "HEAD" ? prerenderedPageHashes(pathname) : undefined;
  const nonce = Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = hashes ? buildCsp({ hashes }) : buildCsp({ nonce }, { dev });
  const isPublic = pathname === "/" || PUBLIC_PAGE_PREFIXES.some((p) => pathname === p || pathname.startsWith(`${p}/`));
  if (!isPublic && !hasSessionCookie(request)) {
    const url = request.nextUrl.clone();
    url.pathname = "/sign-in";
    url.search = "";
    return applySecurityHeaders(NextResponse.redirect(url), csp);
  }

  // A prerendered page's HTML is the same for every request: no nonce to hand to the renderer.
  if (hashes) return applySecurityHeaders(NextResponse.next(), csp);

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", csp);
  return applySecurityHeaders(NextResponse.next({ request: { headers: requestHeaders } }), csp);
}

export const config = {
  matcher: [
    {
      source: "/((?!_next/static|_next/image|favicon.ico|icon.svg|fonts/).*)",
      missing: [{ type: "header", key: "next-router-prefetch" }],
    },
  ],
};
