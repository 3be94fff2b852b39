import { notFound } from "next/navigation";
import { connection } from "next/server";

/**
 * Every address no other page matches. It renders per request, so the not-found page it shows
 * carries the request's CSP nonce: the build's prerendered not-found HTML would be served for any
 * address, and the proxy allows a prerendered page's scripts by hash only at its own address.
 */
export default async function UnknownAddress(): Promise<never> {
  await connection();
  notFound();
}
