import fs from "node:fs";
import path from "node:path";

/**
 * Every route handler under app/, found by walking the folder, so a new route cannot be left
 * out of the security tests: the URL pattern comes from the folder path (route groups dropped,
 * `[id]` → `:id`) and the methods from the file's exports.
 */
export const HTTP_METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

export interface DiscoveredHandler {
  /** "POST /api/jobs/:id/inspections" */
  key: string;
  method: HttpMethod;
  pattern: string;
  params: string[];
  file: string;
  /** The handler reads a JSON body with parseJsonBody. */
  readsJson: boolean;
}

const APP_DIR = path.join(process.cwd(), "app");

function walk(dir: string, out: string[]): void {
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    else if (/^(route|page|layout|actions?)\.(ts|tsx)$/.test(entry.name) || /\.(ts|tsx)$/.test(entry.name)) out.push(full);
  }
}

function patternOf(file: string): { pattern: string; params: string[] } {
  const relative = path.relative(APP_DIR, path.dirname(file)).split(path.sep).filter(Boolean);
  const params: string[] = [];
  const segments = relative
    .filter((segment) => !/^\(.*\)$/.test(segment) && !segment.startsWith("@"))
    .map((segment) => {
      const dynamic = /^\[{1,2}(?:\.\.\.)?([^\]]+)\]{1,2}$/.exec(segment);
      if (!dynamic) return segment;
      params.push(dynamic[1]!);
      return `:${dynamic[1]}`;
    });
  return { pattern: `/${segments.join("/")}`, params };
}

/** Each exported HTTP method and the source text of its handler (up to the next export). */
function exportedHandlers(source: string): { method: HttpMethod; body: string }[] {
  const re = /export\s+(?:const\s+(GET|POST|PUT|PATCH|DELETE)\b|(?:async\s+)?function\s+(GET|POST|PUT|PATCH|DELETE)\b)/g;
  const found: { method: HttpMethod; start: number }[] = [];
  for (let m = re.exec(source); m; m = re.exec(source)) found.push({ method: (m[1] ?? m[2]) as HttpMethod, start: m.index });
  return found.map((f, i) => ({ method: f.method, body: source.slice(f.start, found[i + 1]?.start ?? source.length) }));
}

export function discoverRouteHandlers(): DiscoveredHandler[] {
  const files: string[] = [];
  walk(APP_DIR, files);
  const handlers: DiscoveredHandler[] = [];
  for (const file of files.filter((f) => /[/\\]route\.(ts|tsx|js)$/.test(f))) {
    const source = fs.readFileSync(file, "utf8");
    const { pattern, params } = patternOf(file);
    for (const { method, body } of exportedHandlers(source)) {
      handlers.push({ key: `${method} ${pattern}`, method, pattern, params, file: path.relative(process.cwd(), file), readsJson: /parseJsonBody\s*\(/.test(body) });
    }
  }
  return handlers.sort((a, b) => a.key.localeCompare(b.key));
}

/** Files that declare server actions ("use server"), so the matrix can demand an entry for each. */
export function discoverServerActionFiles(): string[] {
  const files: string[] = [];
  walk(APP_DIR, files);
  walk(path.join(process.cwd(), "lib"), files);
  walk(path.join(process.cwd(), "components"), files);
  return files
    .filter((file) => /^\s*(?:\/\/[^\n]*\n\s*)*["']use server["']/.test(fs.readFileSync(file, "utf8")) || /\n\s*["']use server["'];?/.test(fs.readFileSync(file, "utf8")))
    .map((file) => path.relative(process.cwd(), file))
    .sort();
}

/** Fills a pattern's placeholders: `/api/jobs/:id` + { id: 4 } → `/api/jobs/4`. */
export function fillPattern(pattern: string, values: Record<string, string | number>): string {
  return pattern.replace(/:([A-Za-z0-9_]+)/g, (_, name: string) => {
    const value = values[name];
    if (value === undefined) throw new Error(`no value for :${name} in ${pattern}`);
    return encodeURIComponent(String(value));
  });
}
