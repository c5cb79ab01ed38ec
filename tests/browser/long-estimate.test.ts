// A long estimate on the approver's phone (issue 13): the page draws the API's
// page size of lines at first (the server's HTML holds no more), shows the rest
// a page at a time, and a link to one line far down draws as far as it.
import { and, eq, like, sql } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openDatabase } from "@/db/client";
import { accounts, auditLog, decisions, estimateLines, mailOutbox, statusEvents, units, users, workOrders } from "@/db/schema";
import { PAGE_SIZE } from "@/lib/http/pagination";
import { launch, newContext, PHONE, screenshot, signIn } from "./helpers";

const LINES = 70;
const handle = openDatabase(inject("dbUrl"));
let browser: Browser;
let workOrderId = "";
let lineIds: string[] = [];

beforeAll(async () => {
  browser = await launch();
  const db = handle.db;
  const [township] = await db.select({ id: accounts.id }).from(accounts).where(eq(accounts.name, "Brennan Township Highway Department")).limit(1);
  // One open visit per unit: a unit of the township's not in the shop now.
  const [unit] = await db
    .select({ id: units.id })
    .from(units)
    .where(and(eq(units.accountId, township!.id), sql`not exists (select 1 from ${workOrders} where ${workOrders.unitId} = ${units.id} and ${workOrders.status} <> 'released')`))
    .limit(1);
  const [{ next }] = (await db.select({ next: sql<number>`max(${workOrders.number}) + 1` }).from(workOrders)) as [{ next: number }];
  const now = new Date().toISOString();
  const [wo] = await db
    .insert(workOrders)
    .values({ number: next, unitId: unit!.id, accountId: township!.id, status: "waiting_approval", title: "Lighting, every marker lamp", openedAt: now, sentForApprovalAt: now })
    .returning({ id: workOrders.id });
  workOrderId = wo!.id;
  const rows = await db
    .insert(estimateLines)
    .values(
      Array.from({ length: LINES }, (_, i) => ({
        workOrderId,
        position: i,
        kind: "part" as const,
        description: `Marker lamp ${i + 1}`,
        quantityMilli: 1000,
        unitPriceCents: 1845,
        state: "proposed" as const,
      })),
    )
    .returning({ id: estimateLines.id, position: estimateLines.position });
  lineIds = rows.sort((a, b) => a.position - b.position).map((r) => r.id);
});

afterAll(async () => {
  await browser?.close();
  // The shared database is left as the other files expect it.
  if (workOrderId) {
    // With what the decisions wrote: their timeline entry, audit row and the writer's grouped e-mail, still waiting.
    await handle.db.delete(mailOutbox).where(like(mailOutbox.groupKey, `decision_made:${workOrderId}|%`));
    await handle.db.delete(auditLog).where(eq(auditLog.entityId, workOrderId));
    await handle.db.delete(statusEvents).where(eq(statusEvents.workOrderId, workOrderId));
    await handle.db.delete(decisions).where(eq(decisions.workOrderId, workOrderId));
    await handle.db.delete(estimateLines).where(eq(estimateLines.workOrderId, workOrderId));
    await handle.db.delete(workOrders).where(eq(workOrders.id, workOrderId));
  }
  handle.client.close();
});

async function supervisorCookie(): Promise<string> {
  const [u] = await handle.db.select().from(users).where(eq(users.email, "supervisor@brennan-twp.example")).limit(1);
  return `next-auth.session-token=${await encode({ token: { sub: u!.id, name: u!.name, email: u!.email }, secret: inject("authSecret") })}`;
}

describe("a 70-line estimate on the approver's phone", () => {
  it("the server draws one page of lines; the rest come a page at a time", async () => {
    const res = await fetch(`${inject("baseUrl")}/fleet/work-orders/${workOrderId}`, { headers: { cookie: await supervisorCookie() } });
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html.match(/data-testid="approval-line"/g)?.length).toBe(PAGE_SIZE);
    expect(html).toContain("Marker lamp 50");
    expect(html).not.toContain(">Marker lamp 51<");

    const page = await (await newContext(browser, PHONE)).newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await page.goto(`/fleet/work-orders/${workOrderId}`);
    await page.getByTestId("limits").waitFor();
    expect(await page.getByTestId("approval-line").count()).toBe(PAGE_SIZE);
    expect(await page.getByTestId("lines-drawn").textContent()).toContain(`Showing ${PAGE_SIZE} of ${LINES} lines`);
    await screenshot(page, "long-estimate-supervisor-phone");
    await page.getByRole("button", { name: `Show the next ${LINES - PAGE_SIZE} lines` }).click();
    await page.getByTestId("approval-line").filter({ hasText: `Marker lamp ${LINES}` }).waitFor();
    expect(await page.getByTestId("approval-line").count()).toBe(LINES);
    expect(await page.getByTestId("lines-drawn").count()).toBe(0);
  });

  it("the decision log shows the latest page of decisions, the rest on request", async () => {
    // Sixty lines held in one batch (holding leaves the budget as it is): sixty decisions.
    const held = lineIds.slice(0, 60).map((lineId) => ({ lineId, decision: "hold", expectedVersion: 1, note: "Next budget year." }));
    const res = await fetch(`${inject("baseUrl")}/api/v1/work-orders/${workOrderId}/decisions`, {
      method: "POST",
      headers: { cookie: await supervisorCookie(), "content-type": "application/json", origin: inject("baseUrl") },
      body: JSON.stringify({ decisions: held }),
    });
    expect(res.status).toBe(200);
    const page = await (await newContext(browser, PHONE)).newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await page.goto(`/fleet/work-orders/${workOrderId}`);
    const log = page.getByTestId("decision-log-list").locator("li");
    await log.first().waitFor();
    expect(await log.count()).toBe(PAGE_SIZE);
    await page.getByRole("button", { name: "Show the next 10 decisions" }).click();
    await expect.poll(() => log.count()).toBe(60);
  });

  it("a link to a line past the first page draws as far as it and shows it", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    const target = lineIds[64]!;
    await page.goto(`/fleet/work-orders/${workOrderId}#line-${target}`);
    const line = page.locator(`#line-${target}`);
    await line.waitFor();
    await expect.poll(() => line.isVisible()).toBe(true);
    await expect.poll(async () => (await line.boundingBox())?.y ?? -1).toBeGreaterThanOrEqual(0);
    expect((await line.boundingBox())!.y).toBeLessThan(PHONE.height);
  });
});
