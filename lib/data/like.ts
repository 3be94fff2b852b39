/**
 * A LIKE pattern that finds `text` anywhere in a column, with `%`, `_` and the escape character
 * itself taken literally. Use it with `like ? escape '\'`.
 */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
