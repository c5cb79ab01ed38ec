// Every page under app/ has an entry in the accessibility sweep's list (tests/browser/a11y/pages.ts),
// so a page added later is swept as soon as it exists; and every entry names a real page.
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { PAGES } from "../browser/a11y/pages";

const appDir = path.join(import.meta.dirname, "..", "..", "app");

/** "app/(shop)/units/[id]/page.tsx" → "/units/[id]" (route groups and private folders dropped). */
function routesUnder(dir: string, segments: string[] = []): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (entry.isDirectory()) {
      if (entry.name.startsWith("_") || entry.name === "api") continue;
      const group = /^\(.*\)$/.test(entry.name);
      out.push(...routesUnder(path.join(dir, entry.name), group ? segments : [...segments, entry.name]));
    } else if (/^page\.(tsx|ts|jsx|js|mdx)$/.test(entry.name)) {
      out.push(`/${segments.join("/")}`);
    }
  }
  return out;
}

describe("the accessibility sweep's page list", () => {
  const routes = routesUnder(appDir);

  it("finds the app's pages", () => {
    expect(routes).toContain("/work-orders/[id]");
    expect(routes.length).toBeGreaterThan(20);
  });

  it.each(routes)("%s has an entry (role, viewports, ids)", (route) => {
    expect(PAGES.some((p) => p.route === route), `add ${route} to tests/browser/a11y/pages.ts`).toBe(true);
  });

  it("names only pages that exist, and gives every [param] a query for a real id", () => {
    for (const p of PAGES) {
      expect(routes, p.route).toContain(p.route);
      expect(p.viewports.length).toBeGreaterThan(0);
      if (p.sweptIn) continue;
      for (const param of p.route.match(/\[([^\]]+)\]/g) ?? []) expect(p.ids?.[param.slice(1, -1)], `${p.route} ${param}`).toBeTruthy();
    }
  });

  it("a page swept elsewhere names a browser test that runs the axe check", () => {
    for (const p of PAGES.filter((e) => e.sweptIn)) {
      const source = readFileSync(path.join(import.meta.dirname, "..", "browser", p.sweptIn!), "utf8");
      const checks = source.split("\n").filter((line) => line.includes("expectNoSeriousViolations(") && line.includes(`"${p.route}"`));
      expect(checks.length, `${p.sweptIn} must call expectNoSeriousViolations(page, "${p.route}")`).toBeGreaterThan(0);
    }
  });
});
