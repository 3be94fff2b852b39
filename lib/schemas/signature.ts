import { z } from "zod";
import { SIGNATURE_MESSAGES, SIGNATURE_PNG_MAX_CHARS, SIGNATURE_PNG_PREFIX } from "./signature-values";

export { EMPTY_SIGNATURE, SIGNATURE_MESSAGES, SIGNATURE_PNG_MAX_CHARS, SIGNATURE_PNG_PREFIX, type SignatureValue } from "./signature-values";

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
