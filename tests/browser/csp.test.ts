// The app under its own Content-Security-Policy (proxy.ts, issue 9): signing in,
// the approval page, a photo upload with its progress bar, the payment page and
// its round trip to the payment service, and the occurrence chart, with no
// violation reported by Chromium.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { and, eq, ne } from "drizzle-orm";
import sharp from "sharp";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inject } from "vitest";
import { openDatabase } from "@/db/client";
import { invoices, units, users, workOrders } from "@/db/schema";
import { DESKTOP, PHONE, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
let photoPath: string;
const handle = openDatabase(inject("dbUrl"));
const violations: string[] = [];

beforeAll(async () => {
  browser = await launch();
  const dir = mkdtempSync(path.join(tmpdir(), "cotter-csp-"));
  photoPath = path.join(dir, "wheel-end.jpg");
  writeFileSync(photoPath, await sharp({ create: { width: 1200, height: 900, channels: 3, background: "#5a554c" } }).jpeg().toBuffer());
});

afterAll(async () => {
  await browser?.close();
  handle.client.close();
});

/** A context whose pages report every CSP violation, from the console and from the DOM event. */
async function watched(viewport = PHONE): Promise<BrowserContext> {
  const context = await newContext(browser, viewport);
  await context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => console.error(`CSP violation: ${e.violatedDirective} blocked ${e.blockedURI}`));
  });
  context.on("page", (page) => watch(page));
  return context;
}

function watch(page: Page) {
  page.on("console", (msg) => {
    const text = msg.text();
    if (/Content Security Policy|CSP violation/i.test(text)) violations.push(`${page.url()}: ${text}`);
  });
}

/** A work order waiting on approval, and an approver of its account (other tests decide on some of them). */
async function waitingForApproval(): Promise<{ workOrderId: string; approverEmail: string }> {
  const [row] = await handle.db
    .select({ workOrderId: workOrders.id, approverEmail: users.email })
    .from(workOrders)
    .innerJoin(users, and(eq(users.accountId, workOrders.accountId), eq(users.role, "approver")))
    .where(eq(workOrders.status, "waiting_approval"))
    .limit(1);
  if (!row) throw new Error("no work order waiting on approval");
  return row;
}

async function openVisit(unitNumber: string): Promise<string> {
  const [row] = await handle.db
    .select({ id: workOrders.id })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(and(eq(units.unitNumber, unitNumber), ne(workOrders.status, "released")))
    .limit(1);
  if (!row) throw new Error(`${unitNumber} is not in the shop`);
  return row.id;
}

describe("the app under its Content-Security-Policy", () => {
  it("sends a CSP with a fresh nonce that its own scripts carry", async () => {
    const res = await fetch(`${inject("baseUrl")}/sign-in`);
    const csp = res.headers.get("content-security-policy") ?? "";
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce).toBeTruthy();
    const html = await res.text();
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(3);
    expect(scripts.filter((s) => !s.includes(`nonce="${nonce}"`))).toEqual([]);
    const again = await fetch(`${inject("baseUrl")}/sign-in`);
    expect(again.headers.get("content-security-policy")).not.toContain(nonce);
  });

  it("signs in and shows the approval page with no violation", async () => {
    const context = await watched(PHONE);
    const page = await context.newPage();
    const { workOrderId, approverEmail } = await waitingForApproval();
    await signIn(page, approverEmail);
    await page.goto(`/fleet/work-orders/${workOrderId}`);
    await page.getByTestId("limits").waitFor();
    await page.getByTestId("approval-line").first().waitFor();
    await screenshot(page, "csp-approval-phone");
    await context.close();
    expect(violations).toEqual([]);
  });

  it("uploads a photo with its progress bar, to the upload service, with no violation", async () => {
    const context = await watched(PHONE);
    const page = await context.newPage();
    await signIn(page, "tech@quarry-road.example");
    await page.goto(`/work-orders/${await openVisit("T-9")}/findings/new`);
    await page.getByRole("heading", { name: "Add a finding" }).waitFor();
    await page.getByTestId("photo-input").setInputFiles(photoPath);
    await page.getByTestId("upload-progress").or(page.getByTestId("uploaded-photos")).first().waitFor();
    await page.getByTestId("uploaded-photos").locator("img").waitFor({ timeout: 30_000 });
    // The thumbnail is served by the app's photo route, as an image.
    await expect.poll(() => page.getByTestId("uploaded-photos").locator("img").first().evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBeGreaterThan(0);
    await context.close();
    expect(violations).toEqual([]);
  });

  it("opens the payment page from an invoice and comes back, with no violation", async () => {
    const [account] = await handle.db.select({ accountId: invoices.accountId, id: invoices.id }).from(invoices).where(eq(invoices.status, "open")).limit(1);
    const [payer] = await handle.db.query.users.findMany({ where: (u, { and: both, eq: is }) => both(is(u.accountId, account!.accountId), is(u.role, "approver")), limit: 1 });
    const context = await watched(PHONE);
    const page = await context.newPage();
    await signIn(page, payer!.email);
    const open = await handle.db.query.invoices.findMany({ where: (i, { and: both, eq: is }) => both(is(i.accountId, account!.accountId), is(i.status, "open")) });
    const unpaid = open.find((i) => i.totalCents - i.paidCents - i.creditedCents > 0);
    await page.goto(`/fleet/invoices/${unpaid!.id}`);
    await page.getByRole("button", { name: /Pay .* by card/ }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await page.getByRole("link", { name: "Go back without paying" }).click();
    await page.waitForURL(/checkout=cancelled/);
    await page.getByRole("status").filter({ hasText: "No payment was taken" }).waitFor();
    await context.close();
    expect(violations).toEqual([]);
  });

  it("draws the occurrence chart with no violation", async () => {
    const context = await watched(DESKTOP);
    const page = await context.newPage();
    await signIn(page, "tech@quarry-road.example");
    await page.goto(`/work-orders/${await openVisit("T-9")}`);
    await page.getByTestId("occurrence-chart").locator(".recharts-symbols").first().waitFor();
    await screenshot(page, "csp-occurrence-chart-desktop");
    await context.close();
    expect(violations).toEqual([]);
  });

  it("would notice a violation: an inline handler and an image from elsewhere are refused and reported", async () => {
    const context = await watched(DESKTOP);
    const page = await context.newPage();
    await page.goto("/sign-in");
    const before = violations.length;
    await page.evaluate(() => {
      const box = document.createElement("div");
      box.innerHTML = `<img src="data:," onerror="window.__injected = true">`;
      document.body.appendChild(box);
      const img = document.createElement("img");
      img.src = "https://images.example/x.png";
      document.body.appendChild(img);
    });
    await expect.poll(() => violations.length - before).toBeGreaterThanOrEqual(2);
    expect(await page.evaluate(() => Reflect.get(window, "__injected"))).toBeUndefined();
    violations.length = before;
    await context.close();
  });
});
