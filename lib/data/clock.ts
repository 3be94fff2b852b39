/** The current time as an ISO-8601 string: the one timestamp format stored in every table. */
export function nowIso(): string {
  return new Date().toISOString();
}

export function isoPlus(ms: number, from: Date = new Date()): string {
  return new Date(from.getTime() + ms).toISOString();
}
