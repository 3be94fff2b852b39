/**
 * Password rules after current guidance (length over composition, no forced character classes,
 * refuse known-common and context-derived passwords). Pure: shared by forms and server.
 */
export const PASSWORD_MIN_LENGTH = 12;
/** bcrypt reads only the first 72 bytes; longer passwords would silently be truncated. */
export const PASSWORD_MAX_BYTES = 72;

export const PASSWORD_MESSAGES = {
  tooShort: `Use at least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a strong, memorable password.`,
  tooLong: `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters).`,
  common: "That password is on lists of commonly used passwords. Choose another.",
  context: "Don't use your e-mail address, your name or the product's name in your password.",
  repeated: "That password is one character repeated or a simple sequence. Choose another.",
} as const;

/** Returns the message to show, or null when the password is acceptable. */
export function passwordProblem(password: string, context: { email?: string; name?: string; commonPasswords?: ReadonlySet<string> } = {}): string | null {
  if ([...password].length < PASSWORD_MIN_LENGTH) return PASSWORD_MESSAGES.tooShort;
  if (new TextEncoder().encode(password).length > PASSWORD_MAX_BYTES) return PASSWORD_MESSAGES.tooLong;
  const lower = password.toLowerCase();
  if (/^(.)\1+$/.test(password) || "abcdefghijklmnopqrstuvwxyz0123456789".includes(lower) || "0123456789".repeat(3).includes(lower)) {
    return PASSWORD_MESSAGES.repeated;
  }
  if (context.commonPasswords?.has(lower)) return PASSWORD_MESSAGES.common;
  const words = [context.email?.toLowerCase(), context.email?.split("@")[0]?.toLowerCase(), context.name?.toLowerCase(), "flueward"];
  if (words.some((w) => w && w.length >= 4 && lower.includes(w))) return PASSWORD_MESSAGES.context;
  return null;
}
