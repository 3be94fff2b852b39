import "server-only";

/**
 * A list of about 49,000 commonly used passwords, shipped inside a registry package (no network
 * at run time), loaded once and kept as a set of lower-case strings.
 */
let cached: Promise<ReadonlySet<string>> | null = null;

export function commonPasswords(): Promise<ReadonlySet<string>> {
  cached ??= import("@zxcvbn-ts/language-common").then((mod) => {
    const list = (mod.dictionary as { passwords?: string[] }).passwords ?? [];
    return new Set(list.map((p) => p.toLowerCase()));
  });
  return cached;
}
