import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, test } from "vitest";
import { buildCsp, inlineScriptHashes, readPrerenderedPageHashes, scriptHash } from "@/lib/api/csp";

const scriptSrc = (csp: string) => csp.split(";").map((d) => d.trim()).find((d) => d.startsWith("script-src"))!;

describe("script hashes", () => {
  test("match the hash-source example of the CSP specification", () => {
    // W3C Content Security Policy Level 2/3, "hash-source" example: the inline script
    // `alert('Hello, world.');` is allowed by this value (from memory; SHA-256 per FIPS 180-4).
    expect(scriptHash("alert('Hello, world.');")).toBe("sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng=");
    // SHA-256 of the empty string, FIPS 180-4 / NIST test vectors (e3b0c442…b855), in base64.
    expect(scriptHash("")).toBe("sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU=");
  });

  test("hash the script text as UTF-8 bytes, as browsers do", () => {
    const hashOf = (bytes: number[]) => `sha256-${createHash("sha256").update(Buffer.from(bytes)).digest("base64")}`;
    // "é" is C3 A9 in UTF-8 and E9 in Latin-1.
    expect(scriptHash("é")).toBe(hashOf([0xc3, 0xa9]));
    expect(scriptHash("é")).not.toBe(hashOf([0xe9]));
  });

  test("take every inline script, skip scripts with src, and list each text once", () => {
    const html = [
      '<html><head><script src="/_next/static/chunks/a.js" async=""></script>',
      '<script id="_R_">self.a=1</script></head><body>',
      "<script>self.b=2</script>",
      "<SCRIPT type='text/javascript'>self.c=3</SCRIPT >",
      "<script>self.b=2</script>",
      '<script\nsrc="/x.js"></script></body></html>',
    ].join("");
    expect(inlineScriptHashes(html)).toEqual([scriptHash("self.a=1"), scriptHash("self.b=2"), scriptHash("self.c=3")]);
    expect(inlineScriptHashes("<p>no scripts</p>")).toEqual([]);
  });
});

describe("the page policy", () => {
  test("a page rendered per request allows its nonce and what its scripts load", () => {
    const csp = buildCsp({ nonce: "bm9uY2U=" });
    expect(scriptSrc(csp)).toBe("script-src 'self' 'nonce-bm9uY2U=' 'strict-dynamic'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
  });

  test("a prerendered page allows its own scripts by hash and same-origin script files, without 'strict-dynamic'", () => {
    const csp = buildCsp({ hashes: ["sha256-AAA=", "sha256-BBB="] });
    expect(scriptSrc(csp)).toBe("script-src 'self' 'sha256-AAA=' 'sha256-BBB='");
  });

  test("neither form allows inline scripts wholesale or eval outside development", () => {
    for (const csp of [buildCsp({ nonce: "n" }), buildCsp({ hashes: [] })]) {
      expect(scriptSrc(csp)).not.toContain("'unsafe-inline'");
      expect(scriptSrc(csp)).not.toContain("'unsafe-eval'");
    }
    expect(scriptSrc(buildCsp({ nonce: "n" }, { dev: true }))).toContain("'unsafe-eval'");
  });
});

describe("the build's prerendered pages", () => {
  let dir: string | undefined;
  afterEach(() => {
    if (dir) fs.rmSync(dir, { recursive: true, force: true });
    dir = undefined;
  });

  function buildFolder(routes: Record<string, object>, files: Record<string, string>): string {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-csp-"));
    fs.mkdirSync(path.join(dir, "server", "app"), { recursive: true });
    fs.writeFileSync(path.join(dir, "prerender-manifest.json"), JSON.stringify({ version: 4, routes }));
    for (const [name, text] of Object.entries(files)) fs.writeFileSync(path.join(dir, "server", "app", name), text);
    return dir;
  }

  test("each prerendered page maps to its inline scripts' hashes; not-found and error pages stay out", () => {
    const folder = buildFolder(
      { "/sign-in": { routeType: "page" }, "/_not-found": { routeType: "page" }, "/_global-error": { routeType: "page" }, "/": { routeType: "page" }, "/icon.svg": { routeType: "route" } },
      { "sign-in.html": "<script>one()</script><script>two()</script>", "_not-found.html": "<script>nf()</script>", "index.html": "<script>home()</script>" },
    );
    const pages = readPrerenderedPageHashes(folder);
    expect([...pages.keys()].sort()).toEqual(["/", "/sign-in"]);
    expect(pages.get("/sign-in")).toEqual([scriptHash("one()"), scriptHash("two()")]);
    expect(pages.get("/")).toEqual([scriptHash("home()")]);
  });

  test("a page listed without its HTML, or no build at all, allows nothing by hash", () => {
    expect(readPrerenderedPageHashes(buildFolder({ "/forbidden": { routeType: "page" } }, {})).size).toBe(0);
    expect(readPrerenderedPageHashes(path.join(os.tmpdir(), "flueward-no-such-build")).size).toBe(0);
  });
});
