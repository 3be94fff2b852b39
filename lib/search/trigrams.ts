/**
 * Trigrams for the job search, as a plain B-tree can hold them: `LIKE '%brook%'` cannot seek an
 * index, but every text containing "brook" contains its trigrams "bro", "roo" and "ook", and a
 * table of (trigram, job) pairs finds the jobs holding any one of them by index (the search takes
 * the rarest). Those candidates are then tested with the same LIKE, so the result is exactly what
 * the LIKE scan would give, only without reading every job.
 *
 * Pure and portable (no SQL dialect): SQLite's FTS5 or PostgreSQL's pg_trgm would do the same
 * inside the database, each in its own dialect.
 */

export const TRIGRAM_LENGTH = 3;
/** A query's trigrams are a filter, not the answer: a handful spread over it narrows enough. */
export const MAX_QUERY_TRIGRAMS = 6;

/**
 * Folds A–Z to a–z and leaves every other character as it is: exactly the case folding of
 * SQLite's LIKE, so "text LIKE %q%" holds exactly when the folded text contains the folded q.
 */
export function foldLikeSqlite(text: string): string {
  return text.replace(/[A-Z]/g, (c) => c.toLowerCase());
}

function trigramsOfOne(text: string, into: Set<string>): void {
  const chars = Array.from(foldLikeSqlite(text));
  for (let i = 0; i + TRIGRAM_LENGTH <= chars.length; i++) into.add(chars.slice(i, i + TRIGRAM_LENGTH).join(""));
}

/** Every distinct trigram of the searchable texts of one record (no trigram spans two texts). */
export function trigramsOf(texts: readonly string[]): string[] {
  const grams = new Set<string>();
  for (const text of texts) trigramsOfOne(text, grams);
  return [...grams];
}

/**
 * The trigrams a record must hold to match `query`, at most `max` of them spread from the first to
 * the last; empty when the query is shorter than a trigram (the caller then scans).
 */
export function queryTrigrams(query: string, max = MAX_QUERY_TRIGRAMS): string[] {
  const all = trigramsOf([query]);
  if (all.length <= max) return all;
  const picked = new Set<string>();
  for (let k = 0; k < max; k++) picked.add(all[Math.round((k * (all.length - 1)) / (max - 1))]!);
  return [...picked];
}
