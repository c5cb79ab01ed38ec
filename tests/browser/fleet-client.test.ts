import { mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";
import { runFleetExample } from "@/tests/examples/fleet-client";
import { root, type NextServer } from "@/tests/support/next-server";
import { DESKTOP, launch, newContext, screenshot, signIn } from "./helpers";
import { startOwnAppServer, type OwnAppServer } from "./own-app-server";

/*
 * A fleet's IT person, as they would work: signs in, makes a personal API
 * token, finds the reference from the tokens page, then runs the example
 * script (tests/examples/fleet-client.ts, openapi-fetch with the generated
 * types) against the running app. Its own server on its own demo database,
 * so the approval it makes changes nothing the other browser tests read.
 */
let browser: Browser;
let server: OwnAppServer;
let app: NextServer;
const dir = path.join(root, "tests", ".artifacts", "browser-fleet-client");

beforeAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const dbUrl = `file:${path.join(dir, "cotter.db")}`;
  await migrateDatabase(dbUrl);
  await seedDatabase(dbUrl, { photos: false });
  server = await startOwnAppServer({ name: "fleet-client", dir, dbUrl });
  app = server.app;
  browser = await launch();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe("the fleet API, used as a fleet uses it", () => {
  it("a token from the tokens page, the reference one click away, and the example script lists, reads and approves", async () => {
    const context = await newContext(browser, DESKTOP, app.url);
    const page = await context.newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await page.goto("/fleet/settings/tokens");
    await page.getByLabel("New token name").fill("maintenance system");
    await page.getByRole("button", { name: "Create token" }).click();
    const token = (await page.getByTestId("new-token").locator("code").first().textContent())?.trim() ?? "";
    expect(token).toMatch(/^ctr_/);

    await page.getByRole("link", { name: "API reference" }).click();
    await page.getByRole("heading", { name: "Fleet API reference", level: 1 }).waitFor();
    expect(await page.getByTestId("copy-command").first().textContent()).toBe(`curl -H "Authorization: Bearer $COTTER_TOKEN" "${app.url}/api/v1/units?inShop=true"`);
    expect(await page.getByTestId("api-operation").count()).toBeGreaterThan(40);
    await screenshot(page, "api-reference-fleet-desktop");
    await context.close();

    const said: string[] = [];
    const run = await runFleetExample(app.url, token, (line) => said.push(line));

    // Only the token owner's account: the township's T-14 is in the shop, the school district's bus is not listed.
    expect(run.unitsInShop).toEqual(expect.arrayContaining([expect.objectContaining({ unitNumber: "T-14", status: "waiting_approval" })]));
    expect(run.unitsInShop.map((u) => u.unitNumber)).not.toContain("Bus 22");
    expect(run.workOrder?.label).toBe("W-1042");
    expect(run.workOrder?.lines.length).toBeGreaterThan(5);
    // The smallest pending line: 5 gal × $14.85 = $74.25.
    expect(run.approved?.line).toMatchObject({ description: "Hydraulic fluid, AW-32 (gal)", amountCents: 7425, state: "approved", decision: { by: "Gary Holm", decision: "approve" } });
    expect(said.at(-1)).toMatch(/^approved Hydraulic fluid, AW-32 \(gal\): 74\.25/);

    // The approval is really there: the work order now shows the line approved.
    const wo = await fetch(`${app.url}/api/v1/work-orders/${run.workOrder!.id}`, { headers: { authorization: `Bearer ${token}` } });
    const body = (await wo.json()) as { lines: { id: string; state: string }[] };
    expect(body.lines.find((l) => l.id === run.approved!.line.id)?.state).toBe("approved");

    // A wrong token is refused in words.
    await expect(runFleetExample(app.url, "ctr_not-a-token", () => {})).rejects.toThrow(/listing units: 401 unauthenticated/);
  });
});
