import { describe, expect, test } from "vitest";
import { z } from "zod";
import { AppError, ERROR_STATUS, toErrorResponse } from "@/lib/errors";

describe("the one error shape", () => {
  test("an AppError keeps its code, status, message and fields", () => {
    const { status, body } = toErrorResponse(new AppError("conflict", undefined, { fields: { version: "stale" } }));
    expect(status).toBe(409);
    expect(body.error.code).toBe("conflict");
    expect(body.error.message).toMatch(/Reload/);
    expect(body.error.fields).toEqual({ version: "stale" });
  });

  test("a zod error becomes validation_failed with dotted field paths", () => {
    const schema = z.object({ site: z.object({ street: z.string().min(1, "Enter the street.") }) });
    const result = schema.safeParse({ site: { street: "" } });
    const { status, body } = toErrorResponse(result.error);
    expect(status).toBe(400);
    expect(body.error).toEqual({ code: "validation_failed", message: "Some fields need fixing.", fields: { "site.street": "Enter the street." } });
  });

  test("an unexpected error is a generic 500 that reveals nothing", () => {
    const { status, body } = toErrorResponse(new Error("SQLITE_CONSTRAINT: users.password_hash at /srv/app/db.ts:12"));
    expect(status).toBe(500);
    expect(JSON.stringify(body)).not.toMatch(/SQLITE|password_hash|\.ts/);
  });

  test("every code maps to a 4xx or 5xx status", () => {
    for (const status of Object.values(ERROR_STATUS)) expect(status).toBeGreaterThanOrEqual(400);
  });
});
