import { describe, expect, test } from "vitest";
import { DIRECT_CLIENT, clientAddress, trustedProxyCount } from "@/lib/auth/client-address";

/**
 * X-Forwarded-For is believed only as far as the deployment's trusted proxies wrote it: each
 * proxy appends the address it saw, so with N proxies the client is the Nth entry from the right
 * and anything further left is the client's own claim (RFC 7239 §5.2 describes the same
 * right-to-left reading for the Forwarded header; X-Forwarded-For is common practice).
 */
const headers = (xff?: string) => new Headers(xff === undefined ? {} : { "x-forwarded-for": xff });

describe("TRUSTED_PROXY_COUNT", () => {
  test("unset, empty, negative or not a whole number means no proxy is trusted", () => {
    for (const value of [undefined, "", " ", "-1", "1.5", "one", "0x2", "1e1"]) expect(trustedProxyCount(value)).toBe(0);
  });
  test("a whole number is the count, capped at 10", () => {
    expect(trustedProxyCount("0")).toBe(0);
    expect(trustedProxyCount(" 2 ")).toBe(2);
    expect(trustedProxyCount("99")).toBe(10);
  });
});

describe("the client address", () => {
  test("with no trusted proxy the header is ignored: every request is the one direct client", () => {
    expect(clientAddress(headers("198.51.100.7"), 0)).toBe(DIRECT_CLIENT);
    expect(clientAddress(headers("203.0.113.1, 198.51.100.7"), 0)).toBe(DIRECT_CLIENT);
    expect(clientAddress(headers(), 0)).toBe(DIRECT_CLIENT);
  });
  test("one trusted proxy: the rightmost entry, whatever the client put before it", () => {
    expect(clientAddress(headers("198.51.100.7"), 1)).toBe("198.51.100.7");
    expect(clientAddress(headers("10.9.9.9, 1.2.3.4, 198.51.100.7"), 1)).toBe("198.51.100.7");
  });
  test("two trusted proxies: the second entry from the right", () => {
    expect(clientAddress(headers("6.6.6.6, 198.51.100.7, 10.0.0.2"), 2)).toBe("198.51.100.7");
  });
  test("fewer entries than proxies: the leftmost, which a trusted proxy wrote", () => {
    expect(clientAddress(headers("198.51.100.7"), 3)).toBe("198.51.100.7");
  });
  test("a trusted proxy that sent no header, or only blanks, leaves the direct client", () => {
    expect(clientAddress(headers(), 1)).toBe(DIRECT_CLIENT);
    expect(clientAddress(headers(" , "), 1)).toBe(DIRECT_CLIENT);
  });
  test("the setting is read from the environment", () => {
    const before = process.env.TRUSTED_PROXY_COUNT;
    try {
      process.env.TRUSTED_PROXY_COUNT = "1";
      expect(clientAddress(headers("1.2.3.4, 198.51.100.7"))).toBe("198.51.100.7");
      delete process.env.TRUSTED_PROXY_COUNT;
      expect(clientAddress(headers("1.2.3.4, 198.51.100.7"))).toBe(DIRECT_CLIENT);
    } finally {
      if (before === undefined) delete process.env.TRUSTED_PROXY_COUNT;
      else process.env.TRUSTED_PROXY_COUNT = before;
    }
  });
  test("an over-long entry is cut to the stored column's 100 characters", () => {
    expect(clientAddress(headers("x".repeat(500)), 1)).toHaveLength(100);
  });
});
