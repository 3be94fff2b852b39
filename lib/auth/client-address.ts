/**
 * Which client sent a request, for the sign-in and password re-entry limits and the share-link
 * access log.
 *
 * `next start` fills X-Forwarded-For with the socket's address only when the request did not
 * carry the header already, so a client talking to the server directly can write anything there.
 * The header is therefore read only when the deployment says how many reverse proxies stand in
 * front of the server (TRUSTED_PROXY_COUNT): each of them appends the address it saw, so the
 * client is the entry that many places from the right, and anything further left is the client's
 * own claim. Without the setting every request counts as one client, "direct".
 */
export const DIRECT_CLIENT = "direct";
export const MAX_TRUSTED_PROXY_COUNT = 10;

/** TRUSTED_PROXY_COUNT as a whole number of proxies; unset, empty or not a small whole number is 0. */
export function trustedProxyCount(value: string | undefined = process.env.TRUSTED_PROXY_COUNT): number {
  const trimmed = value?.trim() ?? "";
  if (!/^\d{1,2}$/.test(trimmed)) return 0;
  return Math.min(Number(trimmed), MAX_TRUSTED_PROXY_COUNT);
}

/** The client's address as the nearest trusted proxy chain reports it, or "direct". */
export function clientAddress(headers: Headers, proxies: number = trustedProxyCount()): string {
  if (proxies <= 0) return DIRECT_CLIENT;
  const forwarded = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((entry) => entry.trim())
    .filter(Boolean);
  if (forwarded.length === 0) return DIRECT_CLIENT;
  // Fewer entries than proxies: every entry was written by a trusted proxy, the leftmost is the client.
  const client = forwarded[Math.max(0, forwarded.length - proxies)]!;
  return client.slice(0, 100);
}
