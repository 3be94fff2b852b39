import { z } from "zod";

/** A positive integer id from a route segment or query string. */
export const idSchema = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);
export const idParamsSchema = z.object({ id: idSchema });

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .min(3, "Enter an e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@example.com." }));
