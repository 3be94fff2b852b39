import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { AppError, toErrorResponse, validationError } from "@/lib/errors";
import { isCrossSiteWrite } from "./origin";

export const DEFAULT_JSON_LIMIT_BYTES = 1_000_000;

type RouteContext<P> = { params: Promise<P> };

/**
 * Wraps a route handler: refuses cross-site writes, and turns every thrown error into the one
 * error shape. Unexpected errors are logged on the server and answered with a generic 500.
 */
export function apiRoute<P = Record<string, string>>(
  handler: (request: NextRequest, context: RouteContext<P>) => Promise<Response>,
) {
  return async (request: NextRequest, context: RouteContext<P>): Promise<Response> => {
    try {
      if (isCrossSiteWrite(request)) throw new AppError("cross_site_refused");
      return await handler(request, context);
    } catch (error) {
      const { status, body, headers } = toErrorResponse(error);
      if (status >= 500) console.error(`[api] ${request.method} ${request.nextUrl.pathname}`, error);
      return NextResponse.json(body, { status, headers });
    }
  };
}

export function json<T>(data: T, init: { status?: number; headers?: Record<string, string> } = {}): NextResponse {
  return NextResponse.json(data, { status: init.status ?? 200, headers: { "Cache-Control": "no-store", ...init.headers } });
}

/** An answer already written as JSON (e.g. stored JSON passed through, as UTF-8 bytes), with `json`'s headers. */
export function jsonBody(body: string | Uint8Array<ArrayBuffer>, init: { status?: number; headers?: Record<string, string> } = {}): NextResponse {
  return new NextResponse(body, { status: init.status ?? 200, headers: { "Content-Type": "application/json", "Cache-Control": "no-store", ...init.headers } });
}

/** Reads a JSON body no larger than the limit and parses it with the schema. */
export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S, limitBytes = DEFAULT_JSON_LIMIT_BYTES): Promise<z.infer<S>> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > limitBytes) throw new AppError("payload_too_large", `The request body is larger than ${Math.round(limitBytes / 1000)} kB.`);
  const contentType = request.headers.get("content-type") ?? "";
  if (!contentType.toLowerCase().includes("application/json")) {
    throw new AppError("unsupported_media_type", "Send the body as JSON (Content-Type: application/json).");
  }
  const bytes = await readLimited(request, limitBytes);
  let data: unknown;
  try {
    data = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(bytes));
  } catch {
    throw new AppError("bad_request", "The body is not valid JSON.");
  }
  return parseWith(schema, data);
}

export function parseWith<S extends z.ZodType>(schema: S, data: unknown, message?: string): z.infer<S> {
  const result = schema.safeParse(data);
  if (!result.success) throw validationError(result.error, message);
  return result.data;
}

/** Query parameters as a plain object, parsed with the schema. */
export function parseQuery<S extends z.ZodType>(request: NextRequest, schema: S): z.infer<S> {
  return parseWith(schema, Object.fromEntries(request.nextUrl.searchParams.entries()), "Some query parameters need fixing.");
}

/** Route params (ids) parsed with the schema; a malformed id is a 404, as a missing one would be. */
export async function parseParams<P, S extends z.ZodType>(context: RouteContext<P>, schema: S): Promise<z.infer<S>> {
  const result = schema.safeParse(await context.params);
  if (!result.success) throw new AppError("not_found");
  return result.data;
}

async function readLimited(request: Request, limitBytes: number): Promise<Uint8Array> {
  if (!request.body) return new Uint8Array();
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      await reader.cancel();
      throw new AppError("payload_too_large", `The request body is larger than ${Math.round(limitBytes / 1000)} kB.`);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return out;
}
