import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/**
 * The pages' Content-Security-Policy, in two forms with one set of directives:
 *
 * - A page rendered per request gets a fresh nonce: Next puts it on every script tag it writes,
 *   and `'strict-dynamic'` lets those scripts load the chunks they need.
 * - A page the build prerendered (its HTML is the same for everyone, e.g. /sign-in) cannot carry
 *   a per-request nonce. It gets the sha256 hash of each of its inline scripts instead, and
 *   `'self'` for the framework's script files (CSP Level 3, "hash-source"; no `'strict-dynamic'`,
 *   which would make the browser ignore `'self'`).
 *
 * Neither form allows `'unsafe-inline'` scripts.
 */
export type ScriptPermission = { nonce: string } | { hashes: readonly string[] };

export function buildCsp(scripts: ScriptPermission, options: { dev?: boolean } = {}): string {
  const dev = options.dev ?? false;
  const scriptSources =
    "nonce" in scripts ? [`'nonce-${scripts.nonce}'`, "'strict-dynamic'"] : scripts.hashes.map((hash) => `'${hash}'`);
  return [
    "default-src 'self'",
    ["script-src 'self'", ...scriptSources, ...(dev ? ["'unsafe-eval'"] : [])].join(" "),
    // React writes style attributes (e.g. progress widths); scripts stay nonce- or hash-only.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    `connect-src 'self'${dev ? " ws:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** The CSP hash-source of one inline script: sha256 of its text as UTF-8, in base64. */
export function scriptHash(text: string): string {
  return `sha256-${createHash("sha256").update(text, "utf8").digest("base64")}`;
}

/**
 * The hash of every inline script (a `<script>` without `src`) in an HTML document, in document
 * order, without repeats. React escapes `</script` inside the scripts it writes, so the first
 * closing tag ends each one.
 */
export function inlineScriptHashes(html: string): string[] {
  const hashes = new Set<string>();
  for (const match of html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script\s*>/gi)) {
    const attributes = match[1] ?? "";
    if (/\ssrc\s*=/i.test(` ${attributes}`)) continue;
    hashes.add(scriptHash(match[2] ?? ""));
  }
  return [...hashes];
}

interface PrerenderManifest {
  routes?: Record<string, { initialStatus?: number; routeType?: string }>;
}

/**
 * The pages a production build prerendered, each with the hashes of its HTML's inline scripts,
 * read from the build folder (Next's prerender manifest and the HTML files beside it). Pages
 * whose HTML is served for other addresses (the not-found and error pages) are left out: they
 * stay on the nonce form. Missing files (a dev server, no build) give an empty map.
 */
export function readPrerenderedPageHashes(buildDir: string): Map<string, string[]> {
  const pages = new Map<string, string[]>();
  let manifest: PrerenderManifest;
  try {
    manifest = JSON.parse(fs.readFileSync(path.join(buildDir, "prerender-manifest.json"), "utf8")) as PrerenderManifest;
  } catch {
    return pages;
  }
  for (const [route, entry] of Object.entries(manifest.routes ?? {})) {
    if (entry.routeType !== undefined && entry.routeType !== "page") continue;
    if (route.startsWith("/_")) continue;
    const file = path.join(buildDir, "server", "app", route === "/" ? "index.html" : `${route}.html`);
    try {
      pages.set(route, inlineScriptHashes(fs.readFileSync(file, "utf8")));
    } catch {
      // No HTML for this route (e.g. a route handler's output): nothing to allow.
    }
  }
  return pages;
}
