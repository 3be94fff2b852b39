/**
 * Cross-site request refusal for state-changing methods. Browsers send Origin on every
 * non-GET fetch and form post, and Sec-Fetch-Site on every request; a request that carries
 * neither comes from a script or tool that holds no user's cookie jar.
 */
const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export function isCrossSiteWrite(request: { method: string; headers: Headers }): boolean {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return false;
  const fetchSite = request.headers.get("sec-fetch-site");
  if (fetchSite === "cross-site" || fetchSite === "same-site") return true;
  const origin = request.headers.get("origin");
  if (origin === null) return false;
  if (origin === "null") return true;
  const host = request.headers.get("x-forwarded-host") ?? request.headers.get("host");
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}
