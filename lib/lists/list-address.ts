/**
 * The address of a filtered, paged list: the filters that differ from their defaults, then the
 * page when it is not the first. One builder for the server (pager links) and the browser
 * (filter changes), so both write the same address for the same list.
 */
export type ListFilters = Record<string, string>;

export function listSearch(values: ListFilters, defaults: ListFilters, page = 1): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(values)) {
    const normalised = value.trim();
    if (normalised !== (defaults[key] ?? "")) params.set(key, normalised);
  }
  if (page > 1) params.set("page", String(page));
  const search = params.toString();
  return search ? `?${search}` : "";
}

/** The single value of each search parameter (the first when repeated), for a query schema to parse. */
export function firstValues(searchParams: Record<string, string | string[] | undefined>): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of Object.entries(searchParams)) {
    const first = Array.isArray(value) ? value[0] : value;
    if (first !== undefined) values[key] = first;
  }
  return values;
}

/** What a list schema must offer to read an address (any zod object schema does). */
interface ListQuerySchema<T> {
  safeParse(value: unknown): { success: true; data: T } | { success: false; error: { issues: readonly { message: string }[] } };
  parse(value: unknown): T;
}

/**
 * A list page's query from its address. An address that does not parse (edited by hand, or from
 * an older version) falls back to the defaults, and `problem` says what could not be read, so the
 * page shows the list anyway and tells the user why it is not the one they asked for.
 */
export function readListAddress<T>(schema: ListQuerySchema<T>, searchParams: Record<string, string | string[] | undefined>): { query: T; problem: string | null } {
  const parsed = schema.safeParse(firstValues(searchParams));
  if (parsed.success) return { query: parsed.data, problem: null };
  return { query: schema.parse({}), problem: parsed.error.issues[0]?.message ?? "invalid value" };
}
