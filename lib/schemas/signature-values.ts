/** Signature limits, messages and the empty value, without any validation code (see ./signature). */
export const SIGNATURE_PNG_PREFIX = "data:image/png;base64,";
/** A 600 × 200 box drawn at a phone's pixel ratio stays far below this. */
export const SIGNATURE_PNG_MAX_CHARS = 300_000;

export const SIGNATURE_MESSAGES = {
  typedName: "Type your full name.",
  drawn: "Draw your signature in the box.",
  tooLarge: "The drawn signature is too large. Clear the box and sign again.",
  blank: "The signature box is empty.",
  unreadable: "The signature could not be read. Clear the box and sign again.",
} as const;

/** What the signature field holds while the signer is still drawing. */
export interface SignatureValue {
  typedName: string;
  signaturePng: string | null;
}

export const EMPTY_SIGNATURE: SignatureValue = { typedName: "", signaturePng: null };
