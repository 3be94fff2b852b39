import { describe, expect, test } from "vitest";
import { isCrossSiteWrite } from "@/lib/api/origin";

const req = (method: string, headers: Record<string, string>) => ({ method, headers: new Headers({ host: "app.flueward.test", ...headers }) });

describe("cross-site write refusal", () => {
  test.each([
    ["GET from anywhere is never refused", req("GET", { origin: "https://evil.test", "sec-fetch-site": "cross-site" }), false],
    ["same-origin POST", req("POST", { origin: "https://app.flueward.test", "sec-fetch-site": "same-origin" }), false],
    ["POST from a script without browser headers", req("POST", {}), false],
    ["POST from another origin", req("POST", { origin: "https://evil.test" }), true],
    ["POST with a null origin (sandboxed frame)", req("POST", { origin: "null" }), true],
    ["DELETE marked cross-site by the browser", req("DELETE", { "sec-fetch-site": "cross-site" }), true],
    ["PUT from a sibling subdomain", req("PUT", { "sec-fetch-site": "same-site", origin: "https://other.flueward.test" }), true],
    ["PATCH with a malformed origin", req("PATCH", { origin: "::::" }), true],
  ])("%s", (_name, request, refused) => {
    expect(isCrossSiteWrite(request)).toBe(refused);
  });
});
