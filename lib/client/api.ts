/**
 * The browser's way to call Flueward's API: JSON in, JSON out, and every failure as an ApiError
 * carrying the server's code, message and field errors.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export async function apiFetch<T>(path: string, options: { method?: string; body?: unknown; signal?: AbortSignal } = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      method: options.method ?? "GET",
      headers: options.body === undefined ? { Accept: "application/json" } : { Accept: "application/json", "Content-Type": "application/json" },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      credentials: "same-origin",
      signal: options.signal,
    });
  } catch {
    throw new ApiError(0, "network_error", "Could not reach Flueward. Check the connection and try again.");
  }
  const text = await response.text();
  let data: unknown = null;
  try {
    data = text ? JSON.parse(text) : null;
  } catch {
    data = null;
  }
  if (!response.ok) {
    const error = (data as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
    if (response.status === 401 && typeof window !== "undefined" && !path.startsWith("/api/auth/")) {
      window.location.assign("/sign-in");
    }
    if (error?.code === "password_change_required" && typeof window !== "undefined") {
      window.location.assign("/account?first=1");
    }
    throw new ApiError(response.status, error?.code ?? "http_error", error?.message ?? `The server answered ${response.status}.`, error?.fields ?? {});
  }
  return data as T;
}
