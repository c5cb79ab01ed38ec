import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DECLINED_MESSAGE } from "@/mocks/stripe/server";
import { DESKTOP, PHONE, caughtMail, launch, newContext, screenshot, signIn } from "./helpers";

// Test cards of the local payment fake (mocks/stripe/README.md).
const PAYS = "4242 4242 4242 4242";
const DECLINED = "4000 0000 0000 0002";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function waitForMail(match: (m: { to: string[]; subject: string; text: string }) => boolean) {
  let found: { to: string[]; subject: string; text: string } | undefined;
  await expect.poll(async () => (found = (await caughtMail()).find(match)), { timeout: 20_000, interval: 250 }).toBeDefined();
  return found!;
}

async function payWithCard(page: Page, card: string) {
  await page.getByLabel("Card number").fill(card);
  await page.getByLabel("Expiry (MM / YY)").fill("12 / 40");
  await page.getByLabel("Security code").fill("123");
  await page.getByRole("button", { name: /^Pay / }).click();
}

describe("invoices and card payment, in Chromium", () => {
  let invoiceLabel = "";
  let totalText = "";

  it("the writer corrects an invoice: voids it, re-issues it from the work order, and the clerk is e-mailed", async () => {
    const context = await newContext(browser, DESKTOP);
    const page = await context.newPage();
    await signIn(page, "writer@quarry-road.example");
    await page.goto("/invoices?state=open");
    // The township's newest open invoice with nothing paid on it.
    const row = page.getByTestId("invoice-row").filter({ visible: true, hasText: "Brennan Township" }).first();
    await row.getByRole("link").first().click();
    await page.getByTestId("invoice-document").waitFor();
    const oldLabel = (await page.getByTestId("invoice-document").locator("header p.text-2xl").textContent()) ?? "";
    await screenshot(page, "shop-invoice-desktop");
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "shop-invoice-print");
    expect(await page.locator("header.no-print").isVisible()).toBe(false);
    await page.emulateMedia({ media: "screen" });

    await page.getByTestId("void-invoice").getByLabel("Why is it void?").fill("PO number typed wrong on the invoice");
    await page.getByRole("button", { name: `Void ${oldLabel}` }).click();
    await page.waitForURL(/\/work-orders\/[a-z0-9]+/);
    const section = page.getByTestId("wo-invoice");
    await section.getByText(`Replaces ${oldLabel} (void)`).waitFor();
    await screenshot(page, "shop-work-order-invoice-section");
    await section.getByRole("button", { name: /Issue invoice for/ }).click();
    await page.waitForURL(/\/invoices\/[a-z0-9]+$/);
    const doc = page.getByTestId("invoice-document");
    invoiceLabel = (await doc.locator("header p.text-2xl").textContent()) ?? "";
    expect(Number(invoiceLabel.slice(4))).toBeGreaterThan(Number(oldLabel.slice(4)));
    expect(await doc.innerText()).toContain("Tax exempt · certificate EX-BT-20417");
    totalText = (await page.getByTestId("invoice-totals").locator("dd").nth(-3).textContent()) ?? "";
    expect(totalText).toMatch(/^\$[\d,]+\.\d{2}$/);
    await context.close();
  });

  it("the township clerk opens the e-mailed link, is declined once, then pays by card and sees the invoice paid; the receipt arrives", async () => {
    const mail = await waitForMail((m) => m.to.includes("clerk@brennan-twp.example") && m.subject.startsWith(`Invoice ${invoiceLabel} `));
    expect(mail.subject).toContain(totalText);
    const link = /https?:\/\/\S+\/fleet\/invoices\/[a-z0-9]+/.exec(mail.text)?.[0];
    if (!link) throw new Error("no link in the e-mail");

    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await page.goto(link);
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel("E-mail").fill("clerk@brennan-twp.example");
    await page.getByLabel("Password").fill("cotter-demo");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => link.endsWith(url.pathname));
    const doc = page.getByTestId("invoice-document");
    expect(await doc.locator("[data-state]").first().getAttribute("data-state")).toBe("open");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, "fleet-invoice-clerk-phone");

    // A declined card: the payment page says so and nothing changes.
    await page.getByRole("button", { name: /Pay .* by card/ }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await payWithCard(page, DECLINED);
    await page.getByRole("alert").filter({ hasText: DECLINED_MESSAGE }).waitFor();
    await screenshot(page, "fake-checkout-declined-phone");
    await page.getByRole("link", { name: "Go back without paying" }).click();
    await page.waitForURL(/checkout=cancelled/);
    await page.getByRole("status").filter({ hasText: "No payment was taken. The invoice is still open" }).waitFor();
    expect(await doc.locator("[data-state]").first().getAttribute("data-state")).toBe("open");

    // The test card that pays: back on the invoice, which shows paid once the signed event has arrived.
    await page.getByRole("button", { name: /Pay .* by card/ }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await payWithCard(page, PAYS);
    await page.waitForURL(/checkout=returned/);
    await page.getByTestId("payment-confirmed").waitFor({ timeout: 30_000 });
    expect(await doc.locator("[data-state]").first().getAttribute("data-state")).toBe("paid");
    const text = await doc.innerText();
    expect(text).toContain("Card");
    expect(text).toMatch(/Balance due\s*\$0\.00/);
    await screenshot(page, "fleet-invoice-paid-phone");

    const receipt = await waitForMail((m) => m.to.includes("clerk@brennan-twp.example") && m.subject === `Receipt: ${totalText} for invoice ${invoiceLabel}`);
    expect(receipt.text).toContain("The invoice is now paid in full.");
    await context.close();
  });

  it("the writer records a cheque part payment; the receivables and the clerk's statement show it", async () => {
    const shop = await newContext(browser, DESKTOP);
    const page = await shop.newPage();
    await signIn(page, "writer@quarry-road.example");
    await page.goto("/invoices?state=open");
    await page.getByTestId("invoice-row").filter({ visible: true, hasText: "Kettle Ridge" }).first().getByRole("link").first().click();
    const form = page.getByTestId("record-payment");
    await form.getByLabel("Amount ($)").fill("100.00");
    await form.getByLabel("Cheque number").fill("88120");
    await screenshot(page, "shop-record-payment-desktop");
    await form.getByRole("button", { name: "Record payment" }).click();
    await form.getByRole("status").waitFor();
    const doc = page.getByTestId("invoice-document");
    await expect.poll(() => doc.locator("[data-state]").first().getAttribute("data-state")).toBe("partly_paid");
    expect(await doc.innerText()).toContain("88120");

    await page.goto("/receivables");
    await page.getByTestId("receivables-table").waitFor();
    const table = await page.getByTestId("receivables-table").innerText();
    for (const account of ["Brennan Township Highway Department", "Alder Falls School District Transportation", "Kettle Ridge Stone Co."]) expect(table).toContain(account);
    await page.getByTestId("held-payments").waitFor();
    await screenshot(page, "shop-receivables-desktop");
    await shop.close();

    const fleet = await newContext(browser, PHONE);
    const clerk = await fleet.newPage();
    await signIn(clerk, "clerk@brennan-twp.example");
    await clerk.goto("/fleet/statement");
    await clerk.getByTestId("ageing").waitFor();
    // The demo's open township invoices sit in every past-due bucket (the current one was just paid above).
    for (const bucket of ["days1to30", "days31to60", "days61to90", "over90"]) {
      expect(await clerk.getByTestId("statement-invoices").locator(`[data-bucket="${bucket}"]`).count()).toBeGreaterThan(0);
    }
    expect(await clerk.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(clerk, "fleet-statement-clerk-phone");
    const download = clerk.waitForEvent("download");
    await clerk.getByRole("button", { name: "Download CSV" }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/^invoices-payments-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.csv$/);
    await clerk.goto("/fleet/invoices");
    await screenshot(clerk, "fleet-invoices-clerk-phone");
    await fleet.close();
  });

  it("the writer credits part of an open invoice; the school district's approver sees the credit note on a phone", async () => {
    const shop = await newContext(browser, DESKTOP);
    const page = await shop.newPage();
    await signIn(page, "writer@quarry-road.example");
    await page.goto("/invoices?state=open");
    await page.getByTestId("invoice-row").filter({ visible: true, hasText: "Alder Falls" }).first().getByRole("link").first().click();
    const form = page.getByTestId("credit-note");
    // Refused first (more than is owed): the reason shows and what was typed stays in the form.
    await form.getByLabel("Credit ($)").fill("99999.00");
    await form.getByLabel("What it is for").fill("Goodwill: brake recheck at no charge");
    await form.getByRole("button", { name: "Issue credit note" }).click();
    await form.getByRole("alert").waitFor();
    expect(await form.getByRole("alert").textContent()).toMatch(/is more than the open balance/);
    expect(await form.getByLabel("Credit ($)").inputValue()).toBe("99999.00");
    expect(await form.getByLabel("What it is for").inputValue()).toBe("Goodwill: brake recheck at no charge");
    await form.getByLabel("Credit ($)").fill("25.00");
    await form.getByLabel("What it is for").fill("Goodwill: brake recheck at no charge");
    await form.getByRole("button", { name: "Issue credit note" }).click();
    expect(await form.getByRole("status").textContent()).toMatch(/^CN-\d+ issued\.$/);
    const credits = page.getByTestId("credit-notes");
    await credits.waitFor();
    expect(await credits.innerText()).toContain("Goodwill: brake recheck at no charge");
    expect(await page.getByTestId("invoice-totals").innerText()).toContain("Credited");
    // The payment form now offers the lower balance.
    const balance = (await page.getByTestId("invoice-totals").locator("dd").last().textContent())!.replace(/[$,]/g, "");
    await expect.poll(() => page.getByTestId("record-payment").getByLabel("Amount ($)").inputValue()).toBe(balance);
    await screenshot(page, "shop-invoice-credit-desktop");
    const invoicePath = new URL(page.url()).pathname;
    await shop.close();

    const fleet = await newContext(browser, PHONE);
    const approver = await fleet.newPage();
    await signIn(approver, "transport@alder-falls-schools.example");
    await approver.goto(`/fleet${invoicePath}`);
    await approver.getByTestId("credit-notes").waitFor();
    expect(await approver.getByTestId("credit-notes").innerText()).toContain("$25.00");
    expect(await approver.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(approver, "fleet-invoice-credit-phone");
    await fleet.close();
  });
});

