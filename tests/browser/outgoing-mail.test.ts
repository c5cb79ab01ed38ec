// The owner's Outgoing mail page and the writer's release choice, in Chromium (issue 9).
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inject } from "vitest";
import { openDatabase } from "@/db/client";
import { mailOutbox, workOrders } from "@/db/schema";
import { DESKTOP, PHONE, caughtMail, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
const handle = openDatabase(inject("dbUrl"));

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
  handle.client.close();
});

describe("outgoing mail, in Chromium", () => {
  it("shows the owner a message that failed, and sends it again when asked", async () => {
    const subject = "W-1046 · T-21: ready for pickup (sent again from Outgoing mail)";
    const at = new Date().toISOString();
    await handle.db.insert(mailOutbox).values({
      to: "foreman@brennan-twp.example",
      subject,
      text: "Unit T-21 is ready for pickup.\n",
      html: "<p>Unit T-21 is ready for pickup.</p>",
      template: "unit-ready",
      status: "failed",
      attempts: 8,
      lastError: "connect ECONNREFUSED 127.0.0.1:25",
      sendAfter: at,
      createdAt: at,
    });
    const context = await newContext(browser, DESKTOP);
    const page = await context.newPage();
    await signIn(page, "owner@quarry-road.example");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mail", exact: true }).click();
    await page.getByRole("heading", { name: "Outgoing mail" }).waitFor();
    await page.getByRole("link", { name: /^Failed/ }).click();
    const row = page.getByTestId("outgoing-mail").locator("li").filter({ hasText: subject });
    await row.getByText("connect ECONNREFUSED").waitFor();
    await screenshot(page, "outgoing-mail-failed-owner-desktop");
    await row.getByRole("button", { name: "Send again" }).click();
    await expect.poll(async () => (await caughtMail()).some((m) => m.subject === subject), { timeout: 20_000 }).toBe(true);
    await expect.poll(async () => (await handle.db.select().from(mailOutbox).where(eq(mailOutbox.subject, subject)))[0]?.status).toBe("sent");
    await page.goto("/settings/mail?status=sent");
    await page.getByTestId("outgoing-mail").locator("li").filter({ hasText: subject }).waitFor();
    await screenshot(page, "outgoing-mail-sent-owner-desktop");
    await context.close();
  });

  it("turns a technician away from it with a 403 page that shows nothing of it", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, "tech@quarry-road.example");
    const res = await page.goto("/settings/mail");
    expect(res?.status()).toBe(403);
    await page.getByRole("heading", { name: "Your role does not open this page" }).waitFor();
    expect(await page.getByTestId("outgoing-mail").count()).toBe(0);
    await screenshot(page, "turned-away-tech-phone");
    await context.close();
  });

  it("asks the writer what becomes of lines still waiting before a visit is released", async () => {
    const [wo] = await handle.db.select({ id: workOrders.id }).from(workOrders).where(eq(workOrders.number, 1050));
    const context = await newContext(browser, DESKTOP);
    const page = await context.newPage();
    await signIn(page, "writer@quarry-road.example");
    await page.goto(`/work-orders/${wo!.id}`);
    const mover = page.getByTestId("status-mover");
    await mover.getByRole("combobox").selectOption({ label: "Released" });
    const settle = page.getByTestId("settle-waiting-lines");
    await settle.waitFor();
    const release = mover.getByRole("button", { name: /^Release / });
    expect(await release.isDisabled()).toBe(true);
    await settle.getByLabel(/Decline/).check();
    expect(await release.isDisabled()).toBe(true);
    await settle.getByLabel(/Why/).fill("Customer will replace it in their own yard.");
    expect(await release.isDisabled()).toBe(false);
    await mover.scrollIntoViewIfNeeded();
    await screenshot(page, "release-with-waiting-lines-writer-desktop");
    await context.close();
  });
});
