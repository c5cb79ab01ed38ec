import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { ROOT } from "./server";

export interface PageJs {
  htmlBytes: number;
  /** Gzipped bytes of the framework's root files (build-manifest rootMainFiles), which every page loads. */
  rootGzip: number;
  /** Gzipped bytes of every other script chunk the page names. */
  ownGzip: number;
  own: { file: string; gzip: number }[];
}

/**
 * The JavaScript one page makes the browser load: every chunk the HTML names
 * (script tags and the chunk lists in the inline flight data), read from the
 * build output and gzipped, split into the framework's root files that every
 * page shares and the page's own.
 */
export function pageJs(html: string, distDir: string): PageJs {
  const manifest = JSON.parse(readFileSync(path.join(ROOT, distDir, "build-manifest.json"), "utf8")) as { rootMainFiles: string[]; polyfillFiles: string[] };
  const root = new Set(manifest.rootMainFiles);
  // Polyfills load only in browsers without modules (nomodule): neither the framework's share nor the page's.
  const polyfills = new Set(manifest.polyfillFiles);
  const named = new Set<string>();
  for (const m of html.matchAll(/static\/chunks\/[A-Za-z0-9_\-.~/]+?\.js/g)) named.add(m[0]);
  const gz = (file: string) => {
    const full = path.join(ROOT, distDir, file);
    return existsSync(full) ? gzipSync(readFileSync(full)).length : 0;
  };
  let rootGzip = 0;
  const own: { file: string; gzip: number }[] = [];
  for (const file of root) rootGzip += gz(file);
  for (const file of named) if (!root.has(file) && !polyfills.has(file)) own.push({ file, gzip: gz(file) });
  own.sort((a, b) => b.gzip - a.gzip);
  return { htmlBytes: Buffer.byteLength(html), rootGzip, ownGzip: own.reduce((s, f) => s + f.gzip, 0), own };
}
