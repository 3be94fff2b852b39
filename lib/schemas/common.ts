import { z } from "zod";
import { EMAIL_MAX_LENGTH, EMAIL_MESSAGES, EMAIL_MIN_LENGTH } from "./auth-messages";

/** A positive integer id from a route segment or query string. */
export const idSchema = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);
export const idParamsSchema = z.object({ id: idSchema });

export const emailSchema = z
  .string({ error: EMAIL_MESSAGES.missing })
  .trim()
  .toLowerCase()
  .min(EMAIL_MIN_LENGTH, EMAIL_MESSAGES.missing)
  .max(EMAIL_MAX_LENGTH, EMAIL_MESSAGES.tooLong)
  .pipe(z.email({ error: EMAIL_MESSAGES.invalid }));
