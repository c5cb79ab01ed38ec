// Every page, as the role that uses it, at phone and/or desktop size, checked with axe-core
// against WCAG 2.2 A/AA: no serious or critical violation. The page list is data
// (tests/browser/a11y/pages.ts); a unit test fails when a page under app/ is missing from it.
import type { Browser, BrowserContext } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectNoSeriousViolations, firstValue } from "./a11y/axe";
import { PAGES, type PageEntry, type Viewport } from "./a11y/pages";
import { DESKTOP, PHONE, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
const contexts = new Map<string, BrowserContext>();
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  for (const c of contexts.values()) await c.close();
  await browser?.close();
});

/** One signed-in context per person and size, reused across their pages. */
async function contextFor(as: string, viewport: Viewport): Promise<BrowserContext> {
  const key = `${as}|${viewport}`;
  const existing = contexts.get(key);
  if (existing) return existing;
  const context = await newContext(browser, viewport === "phone" ? PHONE : DESKTOP);
  if (as) {
    const page = await context.newPage();
    await signIn(page, as);
    await page.close();
  }
  contexts.set(key, context);
  return context;
}

async function pathOf(entry: PageEntry): Promise<string> {
  let out = entry.route;
  for (const [param, query] of Object.entries(entry.ids ?? {})) out = out.replace(`[${param}]`, await firstValue(query));
  return out;
}

// Pages swept in another test (their `sweptIn`) are checked there, in the state only it can reach.
const cases = PAGES.filter((entry) => !entry.sweptIn).flatMap((entry) => entry.viewports.map((viewport) => ({ entry, viewport, name: `${entry.route} as ${entry.as || "nobody"} (${viewport})` })));

describe("accessibility: axe-core on every page", () => {
  it.each(cases)("$name: no serious or critical violations", async ({ entry, viewport }) => {
    const context = await contextFor(entry.as, viewport);
    const page = await context.newPage();
    try {
      const path = await pathOf(entry);
      const response = await page.goto(path, { waitUntil: "load" });
      expect(response?.status(), path).toBeLessThan(400);
      if (entry.landsOn) await page.waitForURL(entry.landsOn);
      await page.locator("main, form").first().waitFor();
      // Let client components hydrate and draw what they fetch.
      await page.waitForTimeout(600);
      const slug = `${entry.route.replace(/[^a-z0-9]+/gi, "-").replace(/^-|-$/g, "") || "home"}-${entry.as.split("@")[0] || "nobody"}-${viewport}`;
      await screenshot(page, `a11y-${slug}`);
      await expectNoSeriousViolations(page, entry.route);
    } finally {
      await page.close();
    }
  });
});
