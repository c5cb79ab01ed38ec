import path from "node:path";
import axe from "axe-core";
import type { Page } from "playwright-core";
import { expect } from "vitest";
import { openDatabase } from "@/db/client";

/** WCAG 2.2 A and AA, as axe-core tags them. */
const TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];

export interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: string[];
}

/**
 * Runs axe-core in the page (evaluated through the browser's debugging protocol, so a
 * Content-Security-Policy does not stop it) and returns the serious and critical violations.
 */
export async function seriousViolations(page: Page): Promise<Violation[]> {
  await page.evaluate(axe.source);
  const results = await page.evaluate(async (tags) => {
    const run = (window as unknown as { axe: typeof axe }).axe.run;
    const r = await run(document, { runOnly: { type: "tag", values: tags }, resultTypes: ["violations"] });
    return r.violations.map((v) => ({
      id: v.id,
      impact: v.impact ?? null,
      help: v.help,
      nodes: v.nodes.slice(0, 5).map((n) => `${n.target.join(" ")} — ${n.failureSummary ?? ""}`.slice(0, 300)),
    }));
  }, TAGS);
  return results.filter((v) => v.impact === "serious" || v.impact === "critical");
}

/** The sweep's check on a page as it stands: no serious or critical violation (`route` names it in the message). */
export async function expectNoSeriousViolations(page: Page, route: string): Promise<void> {
  const found = await seriousViolations(page);
  expect(found, `${route}: ${JSON.stringify(found, null, 2)}`).toEqual([]);
}

/** The browser tests' demo database (tests/browser/global-setup.ts), for looking up real ids. */
export async function firstValue(query: string): Promise<string> {
  const file = path.join(import.meta.dirname, "..", "..", ".artifacts", "browser", "cotter.db");
  const { client } = openDatabase(`file:${file}`);
  try {
    const row = (await client.execute(query)).rows[0];
    const value = row ? Object.values(row)[0] : undefined;
    if (value === undefined || value === null) throw new Error(`no row for ${query}`);
    return String(value);
  } finally {
    client.close();
  }
}
