import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";

/**
 * Every page and route handler in app/, read from the file tree the way Next
 * maps it to URLs, so a test that walks this list covers a route the day it is
 * added, without anyone editing the test.
 */
export const APP_DIR = path.join(import.meta.dirname, "..", "..", "app");

export const HTTP_METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

export interface AppRoute {
  kind: "page" | "api";
  /** The source file, relative to the repository. */
  file: string;
  /** The URL pattern with its dynamic segments, e.g. /fleet/invoices/[id]. */
  pattern: string;
  /** The route group it sits in ("shop", "fleet", "auth"), or null. */
  group: string | null;
  /** Route handlers only: the methods the file exports. */
  methods: HttpMethod[];
}

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? walk(full) : [full];
  });
}

function exportedMethods(source: string): HttpMethod[] {
  const found = new Set<HttpMethod>();
  for (const m of HTTP_METHODS) {
    if (new RegExp(`export\\s+(const|let|async\\s+function|function)\\s+${m}\\b`).test(source)) found.add(m);
    if (new RegExp(`export\\s*\\{[^}]*\\bas\\s+${m}\\b[^}]*\\}`).test(source)) found.add(m);
    if (new RegExp(`export\\s*\\{[^}]*(^|[\\s,{])${m}\\s*[,}]`).test(source)) found.add(m);
  }
  return [...found];
}

export function appRoutes(): AppRoute[] {
  const routes: AppRoute[] = [];
  for (const full of walk(APP_DIR)) {
    const base = path.basename(full);
    const kind = /^page\.(tsx|ts|jsx|js)$/.test(base) ? "page" : /^route\.(ts|js)$/.test(base) ? "api" : null;
    if (!kind) continue;
    const dirs = path.relative(APP_DIR, path.dirname(full)).split(path.sep).filter(Boolean);
    // Route groups "(name)" and private folders "_name" are not part of the URL; parallel slots "@name" neither.
    const groupDir = dirs.find((d) => /^\(.+\)$/.test(d));
    const urlSegments = dirs.filter((d) => !/^\(.+\)$/.test(d) && !d.startsWith("@") && !d.startsWith("_"));
    const source = readFileSync(full, "utf8");
    routes.push({
      kind,
      file: path.relative(path.join(APP_DIR, ".."), full),
      pattern: `/${urlSegments.join("/")}`,
      group: groupDir ? groupDir.slice(1, -1) : null,
      methods: kind === "api" ? exportedMethods(source) : ["GET"],
    });
  }
  return routes.sort((a, b) => a.pattern.localeCompare(b.pattern));
}

/** The dynamic segments of a pattern, each keyed by the folder before it: "invoices/[id]", "auth/[...nextauth]". */
export function paramKeys(pattern: string): string[] {
  const parts = pattern.split("/").filter(Boolean);
  return parts.flatMap((part, i) => (/^\[.+\]$/.test(part) ? [`${parts[i - 1] ?? ""}/${part}`] : []));
}

/**
 * A real URL for a pattern: each dynamic segment takes the value mapped to its
 * key. A segment nobody has mapped stops the run with a message saying where
 * to add it, rather than quietly leaving the route out.
 */
export function fillPattern(pattern: string, values: Record<string, string>, mapFile: string): string {
  const parts = pattern.split("/");
  return parts
    .map((part, i) => {
      if (!/^\[.+\]$/.test(part)) return part;
      const key = `${parts[i - 1] ?? ""}/${part}`;
      const value = values[key];
      if (value === undefined) {
        throw new Error(`The route ${pattern} has a dynamic segment "${key}" with no id to try. Add "${key}" to the map in ${mapFile}.`);
      }
      return encodeURIComponent(value);
    })
    .join("/");
}

/** A page's source, following `export { default } from "@/…"` to the page it re-uses. */
export function pageSource(file: string): string {
  const root = path.join(APP_DIR, "..");
  const source = readFileSync(path.join(root, file), "utf8");
  const reexport = /export\s*\{[^}]*\bdefault\b[^}]*\}\s*from\s*"@\/([^"]+)"/.exec(source);
  if (!reexport) return source;
  const target = ["", ".tsx", ".ts"].map((ext) => `${reexport[1]}${ext}`).find((p) => existsSync(path.join(root, p)) && statSync(path.join(root, p)).isFile());
  if (!target) throw new Error(`${file} re-exports ${reexport[1]}, which does not exist`);
  return pageSource(target);
}
