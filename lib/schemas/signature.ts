import { z } from "zod";

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

/**
 * A signature: the signer's typed full name and the drawing as a PNG data URL. The same schema
 * checks the form in the browser and the body on the server; the server also checks the PNG's
 * content (`assertDrawnSignature`).
 */
export const signatureSchema = z.object({
  typedName: z.string({ error: SIGNATURE_MESSAGES.typedName }).trim().min(2, SIGNATURE_MESSAGES.typedName).max(200, SIGNATURE_MESSAGES.typedName),
  signaturePng: z
    .string({ error: SIGNATURE_MESSAGES.drawn })
    .startsWith(SIGNATURE_PNG_PREFIX, SIGNATURE_MESSAGES.drawn)
    .max(SIGNATURE_PNG_MAX_CHARS, SIGNATURE_MESSAGES.tooLarge),
});
export type SignatureInput = z.input<typeof signatureSchema>;

/** What the signature field holds while the signer is still drawing. */
export interface SignatureValue {
  typedName: string;
  signaturePng: string | null;
}

export const EMPTY_SIGNATURE: SignatureValue = { typedName: "", signaturePng: null };
