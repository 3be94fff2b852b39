import { ZodError } from "zod";

/**
 * The one error vocabulary of Flueward's API. Every failure leaves the server as
 * `{ "error": { "code", "message", "fields"? } }` with the status below; stack traces and
 * database messages never do.
 */
export const ERROR_STATUS = {
  validation_failed: 400,
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  cross_site_refused: 403,
  password_change_required: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  internal_error: 500,
} as const satisfies Record<string, number>;

export type ErrorCode = keyof typeof ERROR_STATUS;

export const DEFAULT_MESSAGES = {
  validation_failed: "Some fields need fixing.",
  bad_request: "The request could not be read.",
  unauthenticated: "Sign in to continue.",
  forbidden: "Your role does not allow this.",
  cross_site_refused: "This request came from another site and was refused.",
  password_change_required: "You signed in with a temporary password. Choose your own password on the Account page first.",
  not_found: "Not found.",
  conflict: "Someone else changed this since you opened it. Reload to see their changes.",
  gone: "This link is no longer available.",
  payload_too_large: "The upload is too large.",
  unsupported_media_type: "That kind of file is not accepted.",
  unprocessable: "The request could not be carried out.",
  rate_limited: "Too many attempts. Wait a little and try again.",
  internal_error: "Something went wrong on our side. Nothing was changed; try again.",
} as const satisfies Record<ErrorCode, string>;

export type FieldErrors = Record<string, string>;

export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: FieldErrors };
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: FieldErrors;
  readonly headers?: Record<string, string>;

  constructor(code: ErrorCode, message?: string, options: { fields?: FieldErrors; headers?: Record<string, string> } = {}) {
    super(message ?? DEFAULT_MESSAGES[code]);
    this.name = "AppError";
    this.code = code;
    this.fields = options.fields;
    this.headers = options.headers;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

/** Turns a zod error into a field → message map keyed by dotted paths (`site.street`, `rows.3.heightFt`). */
export function fieldErrorsFromZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "_";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

export function validationError(error: ZodError, message?: string): AppError {
  return new AppError("validation_failed", message, { fields: fieldErrorsFromZod(error) });
}

/** The body and status for any thrown value; unexpected errors become a generic 500. */
export function toErrorResponse(error: unknown): { status: number; body: ErrorBody; headers?: Record<string, string> } {
  if (error instanceof AppError) {
    const body: ErrorBody = { error: { code: error.code, message: error.message } };
    if (error.fields) body.error.fields = error.fields;
    return { status: error.status, body, headers: error.headers };
  }
  if (error instanceof ZodError) {
    const appError = validationError(error);
    return { status: 400, body: { error: { code: appError.code, message: appError.message, fields: appError.fields } } };
  }
  return { status: 500, body: { error: { code: "internal_error", message: DEFAULT_MESSAGES.internal_error } } };
}
