/**
 * What the sign-in checks say, in one zod-free place: the schemas use these on the server and
 * the sign-in form shows the same words in the browser before it sends anything.
 */
export const EMAIL_MESSAGES = {
  missing: "Enter an e-mail address.",
  invalid: "Enter a valid e-mail address, like name@example.com.",
  tooLong: "That e-mail address is too long.",
} as const;

export const PASSWORD_MESSAGES = {
  missing: "Enter your password.",
  tooLong: "That password is too long.",
} as const;

export const EMAIL_MIN_LENGTH = 3;
export const EMAIL_MAX_LENGTH = 254;
/** Characters, not bytes: a sign-in attempt is refused before hashing when longer. */
export const SIGN_IN_PASSWORD_MAX_LENGTH = 1000;

export const CHANGE_PASSWORD_MESSAGES = {
  currentMissing: "Enter your current password.",
  newMissing: "Enter a new password.",
  confirmMissing: "Repeat the new password.",
  differ: "The two new passwords differ.",
} as const;
