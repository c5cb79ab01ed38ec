import { mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { migrateDatabase } from "@/db/migrate";
import { withCheckDigit } from "@/lib/vin";
import type { CaughtMail } from "@/mocks/smtp/server";
import { mailbox } from "@/tests/support/mailbox";
import { root, type NextServer } from "@/tests/support/next-server";
import { expectNoSeriousViolations } from "./a11y/axe";
import { DESKTOP, PHONE, launch, newContext, screenshot } from "./helpers";
import { startOwnAppServer, type OwnAppServer } from "./own-app-server";

/*
 * The first week of a shop that installs Cotter on an EMPTY database: no demo
 * data. Its own server (own database file, mail catcher, payment and upload
 * fakes, port), beside the demo server the other browser tests share.
 */
// A form's refusal; Next's own route announcer also has role="alert".
const ALERT = '[role="alert"]:not(#__next-route-announcer__)';

let browser: Browser;
// The run's one mail catcher, in a mailbox of this server's own.
const smtp = mailbox(inject("mailCatcher"), "first-week");
let server: OwnAppServer;
let app: NextServer;
const dir = path.join(root, "tests", ".artifacts", "browser-empty");

beforeAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const dbUrl = `file:${path.join(dir, "shop.db")}`;
  await migrateDatabase(dbUrl);
  server = await startOwnAppServer({
    name: "first-week",
    dir,
    dbUrl,
    env: { MAIL_FROM: "Millbrook Diesel & Hydraulic <service@millbrook-diesel.example>" },
  });
  app = server.app;
  browser = await launch();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const contexts: BrowserContext[] = [];
async function person(viewport: typeof PHONE): Promise<Page> {
  const context = await newContext(browser, viewport, app.url);
  contexts.push(context);
  return context.newPage();
}

async function mailTo(email: string, subject: RegExp): Promise<CaughtMail> {
  return smtp.waitFor((m) => m.to.includes(email) && subject.test(m.subject), 20_000);
}

function linkIn(mail: CaughtMail, pathPart: string): string {
  const match = new RegExp(`https?://\\S+(${pathPart}\\S*)`).exec(mail.text);
  if (!match?.[1]) throw new Error(`no ${pathPart} link in “${mail.subject}”`);
  return match[1];
}

/** The person opens the invitation link from the caught mail and chooses their own password. */
async function acceptInvitation(page: Page, email: string, password: string) {
  const mail = await mailTo(email, /invited you to Cotter/);
  await page.goto(linkIn(mail, "/invitation/"));
  await page.getByLabel("Choose a password").waitFor();
  // The accessibility sweep's check for this page, in the state only a live link shows (tests/browser/a11y/pages.ts).
  await expectNoSeriousViolations(page, "/invitation/[token]");
  await page.getByLabel("Choose a password").fill(password);
  await page.getByLabel("The same password again").fill(password);
  await page.getByRole("button", { name: "Save my password and sign in" }).click();
  await page.waitForURL((url) => url.pathname === "/floor" || url.pathname === "/fleet");
}

async function invite(page: Page, who: { name: string; email: string; role?: string; limit?: string }) {
  const form = page.getByTestId("invite-form");
  await form.getByLabel("Name").fill(who.name);
  await form.getByLabel("E-mail").fill(who.email);
  if (who.role) await form.getByLabel("Role").selectOption(who.role);
  if (who.limit) await form.getByLabel("Signing limit ($ per work order)").fill(who.limit);
  await form.getByRole("button", { name: "Send invitation" }).click();
  await form.getByText(`Invitation sent to ${who.email}`).waitFor();
}

// Invented VINs: region 0 and the "0CT" prefix are assigned to no maker; check digits by 49 CFR 565.15(c).
const VIN = withCheckDigit("0CTHC4510NA210044");
const wrongDigit = String((Number.isNaN(Number(VIN[8])) ? 1 : Number(VIN[8]) + 1) % 10);
const WRONG_VIN = `${VIN.slice(0, 8)}${wrongDigit}${VIN.slice(9)}`;
const CSV_VINS = ["0CTHC4510NA210045", "0CTHC4510PA210046", "0CTPK2210NA210047"].map(withCheckDigit);

describe("the first week of a new shop, from an empty database", () => {
  let writer: Page;
  let tech: Page;
  let approver: Page;
  let accountUrl = "";
  let workOrderUrl = "";

  it("the owner sets up the shop on the one-time page and invites a writer and a technician", async () => {
    const owner = await person(DESKTOP);
    await owner.goto("/");
    await owner.waitForURL(/\/setup$/);
    await owner.getByLabel("Shop name").waitFor();
    await expectNoSeriousViolations(owner, "/setup");
    await owner.getByLabel("Shop name").fill("Millbrook Diesel & Hydraulic");
    await owner.getByLabel("Street address").fill("77 Sawmill Road");
    await owner.getByLabel("Town, state and ZIP").fill("Millbrook Junction");
    await owner.getByLabel("Phone").fill("(555) 010-3300");
    await owner.getByLabel("Labour rate ($ per hour)").fill("138.00");
    await owner.getByLabel("Your name").fill("Irene Vasquez");
    await owner.getByLabel("Your e-mail").fill("irene@millbrook-diesel.example");
    await owner.getByLabel("Choose a password").fill("millbrook-owner-pass");
    await owner.getByLabel("The same password again").fill("millbrook-owner-pass");
    await screenshot(owner, "first-week-01-setup-desktop");
    await owner.getByRole("button", { name: "Set up Cotter" }).click();
    await owner.waitForURL(/\/settings\/people$/);
    // Gone for good: the set-up page is not found now, and its API answers 409.
    expect((await owner.request.get("/setup")).status()).toBe(404);
    expect((await owner.request.post("/api/v1/setup", { data: {} })).status()).toBe(400);

    await invite(owner, { name: "Marcus Webb", email: "marcus@millbrook-diesel.example", role: "writer" });
    await invite(owner, { name: "Ana Duarte", email: "ana@millbrook-diesel.example", role: "tech" });
    await owner.getByTestId("pending-invitations").getByText("ana@millbrook-diesel.example").waitFor();
    await screenshot(owner, "first-week-02-people-desktop");
  });

  it("the writer and the technician set their own passwords from the e-mailed links", async () => {
    writer = await person(DESKTOP);
    await acceptInvitation(writer, "marcus@millbrook-diesel.example", "marcus-writes-orders");
    tech = await person(PHONE);
    await acceptInvitation(tech, "ana@millbrook-diesel.example", "ana-turns-wrenches");
    await tech.getByRole("heading", { name: "Floor", exact: true }).waitFor();
    // The same link a second time is spent.
    const again = await person(PHONE);
    await again.goto(linkIn(await mailTo("ana@millbrook-diesel.example", /invited you/), "/invitation/"));
    await again.getByTestId("link-refusal").getByText("already been used").waitFor();
  });

  it("the writer creates a fleet account and invites its approver and its foreman", async () => {
    await writer.goto("/accounts/new");
    await writer.getByLabel("Account name").fill("Harrow Creek Road Commission");
    await writer.getByLabel("Billing e-mail").fill("payables@harrow-creek.example");
    await writer.getByLabel("Billing address").fill("2 Commission Street\nHarrow Creek");
    await writer.getByLabel("Phone").fill("(555) 010-8812");
    await writer.getByLabel("Standing authorisation ($ per work order)").fill("150.00");
    // New accounts start on the Florida overrun shape (reference-values.md).
    expect(await writer.getByRole("button", { name: /Florida 559\.909/ }).getAttribute("aria-pressed")).toBe("true");
    await writer.getByRole("button", { name: "Create the account" }).click();
    // Ids are 20 characters: not "/accounts/new".
    await writer.waitForURL(/\/accounts\/[a-z0-9]{20}$/);
    accountUrl = new URL(writer.url()).pathname;
    await invite(writer, { name: "Della Ruiz", email: "della@harrow-creek.example", role: "approver", limit: "5000" });
    await invite(writer, { name: "Tom Brecker", email: "tom@harrow-creek.example", role: "viewer" });
    await screenshot(writer, "first-week-03-account-desktop");
    // The approver sets her own password from the link, on her phone.
    approver = await person(PHONE);
    await acceptInvitation(approver, "della@harrow-creek.example", "della-signs-off");
    await approver.getByRole("heading", { name: "Your units" }).waitFor();
  });

  it("the writer adds a unit: a wrong check digit is refused with the right digit named, then the valid VIN", async () => {
    await writer.getByRole("link", { name: "Add a unit" }).click();
    await writer.waitForURL(/\/units\/new/);
    await writer.getByLabel("Unit number").fill("HC-12");
    await writer.getByLabel("Model year").fill("2022");
    await writer.getByLabel("VIN", { exact: true }).fill(WRONG_VIN);
    const check = writer.getByTestId("vin-check");
    await expect.poll(() => check.textContent()).toContain(`Position 9 should be ${VIN[8]}`);
    await writer.getByLabel("Description").fill("Tandem-axle dump with front plow");
    await writer.getByLabel("Odometer (mi)").fill("41200");
    await writer.getByRole("button", { name: "Add the unit" }).click();
    await writer.locator(ALERT).first().waitFor();
    expect(new URL(writer.url()).pathname).toBe("/units/new");
    await screenshot(writer, "first-week-04-vin-refused-desktop");
    await writer.getByLabel("VIN", { exact: true }).fill(VIN.toLowerCase());
    await expect.poll(() => check.getAttribute("data-state")).toBe("ok");
    await writer.getByRole("button", { name: "Add the unit" }).click();
    await writer.getByRole("heading", { name: "Unit HC-12" }).waitFor();
    expect(await writer.locator("main").innerText()).toContain(VIN);
  });

  it("imports three more from CSV: one bad row is shown and nothing is written; fixed, all three go in", async () => {
    await writer.goto(`${accountUrl}/import`);
    const header = "unitNumber,vin,year,description,plate";
    const bad = [header, `HC-14,${CSV_VINS[0]},2022,Tandem-axle dump,HC-0014`, `HC-15,${CSV_VINS[1]!.slice(0, 16)},2023,Tandem-axle dump with wing,HC-0015`, `HC-16,${CSV_VINS[2]},2022,Crew-cab pickup,HC-0016`].join("\n");
    await writer.getByLabel("…or paste the text").fill(bad);
    await writer.getByRole("button", { name: "Check the file" }).click();
    const preview = writer.getByTestId("import-preview");
    await preview.getByText("1 problem: nothing will be imported").waitFor();
    expect(await preview.locator('[data-testid="import-row"][data-ok="false"]').innerText()).toContain("17 characters; this one has 16");
    expect(await writer.getByRole("button", { name: /^Import \d+ units?$/ }).count()).toBe(0);
    await screenshot(writer, "first-week-05-csv-preview-desktop");
    await writer.goto("/units");
    expect(await writer.getByTestId("unit-row").count()).toBe(1);

    await writer.goto(`${accountUrl}/import`);
    await writer.getByLabel("…or paste the text").fill(bad.replace(CSV_VINS[1]!.slice(0, 16), CSV_VINS[1]!));
    await writer.getByRole("button", { name: "Check the file" }).click();
    await writer.getByTestId("import-preview").getByText("All 3 rows are good").waitFor();
    await writer.getByRole("button", { name: "Import 3 units" }).click();
    await writer.getByTestId("import-done").getByText("Imported 3 units.").waitFor();
    await writer.goto("/units?q=HC-1");
    expect(await writer.getByTestId("unit-row").count()).toBe(4);
    // Any four characters of a VIN find its unit.
    // The last five characters of HC-16's VIN, which no other unit shares.
    await writer.goto(`/units?q=${CSV_VINS[2]!.slice(-5)}`);
    expect(await writer.getByTestId("unit-row").allInnerTexts()).toEqual([expect.stringContaining("HC-16")]);
  });

  it("the foreman, who set his own password, reports a defect from his phone", async () => {
    const foreman = await person(PHONE);
    await acceptInvitation(foreman, "tom@harrow-creek.example", "tom-drives-the-plow");
    await foreman.getByRole("link", { name: "Report a defect" }).first().click();
    await foreman.waitForURL(/\/fleet\/reports\/new/);
    await foreman.getByRole("combobox", { name: /^Unit/ }).selectOption({ label: "HC-12 · Tandem-axle dump with front plow" });
    await foreman.getByLabel("Where on the unit").selectOption("Service brakes and trailer brake connections");
    await foreman.getByLabel("What is wrong").fill("Air leak at the left rear brake chamber; pressure drops with the brakes applied.");
    await foreman.getByRole("checkbox").first().check();
    await foreman.getByLabel("Odometer (mi), if you can read it").fill("41310");
    expect(await foreman.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(foreman, "first-week-06-defect-report-foreman-phone");
    await foreman.getByRole("button", { name: "Send the report" }).click();
    await foreman.getByTestId("report-sent").waitFor();
    await foreman.goto("/fleet/reports");
    await foreman.getByTestId("report-status").getByText("Reported, waiting for the shop").waitFor();
  });

  it("the writer checks the unit in from that report, with a technician and a promised-by time", async () => {
    await writer.goto("/floor");
    await writer.getByRole("link", { name: "Check HC-12 in from this report" }).click();
    await writer.waitForURL(/\/work-orders\/new\?serviceRequestId=/);
    const form = writer.getByTestId("check-in-form");
    expect(await form.getByLabel("Concern 1").inputValue()).toContain("Air leak at the left rear brake chamber");
    await form.getByLabel("Technician").selectOption({ label: "Ana Duarte" });
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    await form.getByLabel("Promised by").fill(`${tomorrow}T15:30`);
    await screenshot(writer, "first-week-07-check-in-desktop");
    await form.getByRole("button", { name: "Check HC-12 in" }).click();
    await writer.waitForURL(/\/work-orders\/[a-z0-9]+$/);
    workOrderUrl = new URL(writer.url()).pathname;
    await writer.getByRole("heading", { name: /HC-12/ }).waitFor();
    expect(await writer.locator("main header").first().innerText()).toContain("Ana Duarte");
    // The approver hears the unit is in.
    const mail = await mailTo("della@harrow-creek.example", /HC-12 checked in/);
    expect(mail.text).toContain("/fleet/units/");
  });

  it("the technician writes cause and correction on the phone", async () => {
    await tech.goto("/floor");
    await tech.getByTestId("floor-card").filter({ hasText: "HC-12" }).first().click();
    await tech.waitForURL(/\/work-orders\//);
    const concern = tech.getByTestId("concern").first();
    await concern.getByLabel("Cause").fill("Left rear brake chamber diaphragm split.");
    await concern.getByLabel("Correction").fill("Replaced the brake chamber; leak-down test passed.");
    await concern.getByRole("button", { name: "Save cause and correction" }).click();
    await concern.getByRole("status").getByText("Saved.").waitFor();
    expect(await tech.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await concern.scrollIntoViewIfNeeded();
    await screenshot(tech, "first-week-08-cause-correction-tech-phone");
  });

  it("the writer prices the work and sends the estimate; the approver approves it on her phone", async () => {
    await writer.goto(workOrderUrl);
    await writer.getByRole("button", { name: "+ Add a line to this concern" }).first().click();
    const line = writer.getByTestId("line-form");
    await line.getByRole("button", { name: "Part", exact: true }).click();
    await line.getByLabel("Description").fill("Brake chamber, type 30/30 long stroke");
    await line.getByLabel("Quantity").fill("1");
    await line.getByLabel("Unit price ($)").fill("96.50");
    await line.getByRole("button", { name: "Add line" }).click();
    await writer.getByTestId("estimate-line").filter({ hasText: "Brake chamber" }).waitFor();
    await writer.getByRole("button", { name: "+ Add a line to this concern" }).first().click();
    await line.getByRole("button", { name: "Labour", exact: true }).click();
    await line.getByLabel("Description").fill("Replace brake chamber and test");
    await line.getByLabel("Hours (tenths)").fill("1.2");
    await line.getByLabel("Rate ($/h)").fill("138.00");
    await line.getByRole("button", { name: "Add line" }).click();
    await writer.getByTestId("estimate-line").filter({ hasText: "Replace brake chamber" }).waitFor();
    await writer.getByTestId("send-estimate").click();
    await writer.getByText(/Sent 2 lines to Harrow Creek Road Commission/).waitFor();

    const estimate = await mailTo("della@harrow-creek.example", /estimate ready/);
    await approver.goto(linkIn(estimate, "/fleet/work-orders/"));
    await approver.getByTestId("approve-all").click();
    await expect.poll(() => approver.getByTestId("approval-line").evaluateAll((els) => els.map((e) => e.getAttribute("data-state")))).toEqual(["approved", "approved"]);
    expect(await approver.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(approver, "first-week-09-approval-approver-phone");
  });

  it("the work is done and invoiced: the invoice shows complaint, cause and correction", async () => {
    await writer.goto(workOrderUrl);
    const notDone = writer.getByTestId("not-done");
    await notDone.waitFor();
    for (const box of await notDone.getByRole("checkbox").all()) await box.check();
    await notDone.getByRole("button", { name: "Mark ticked lines done" }).click();
    await writer.getByTestId("wo-invoice").getByRole("button", { name: /Issue invoice for/ }).click();
    await writer.waitForURL(/\/invoices\/[a-z0-9]+$/);
    const threeCs = writer.getByTestId("invoice-three-cs");
    const text = await threeCs.innerText();
    expect(text).toContain("Air leak at the left rear brake chamber");
    expect(text).toContain("Left rear brake chamber diaphragm split.");
    expect(text).toContain("Replaced the brake chamber; leak-down test passed.");
    expect(await writer.getByTestId("invoice-document").innerText()).toContain("Millbrook Diesel & Hydraulic");
    await screenshot(writer, "first-week-10-invoice-desktop");
  });

  it("the week's lists: the writer's units and work orders, the foreman's reports on his phone", async () => {
    await writer.goto("/units");
    expect(await writer.getByTestId("unit-row").count()).toBe(4);
    await screenshot(writer, "first-week-11-units-desktop");
    await writer.goto("/work-orders");
    expect(await writer.getByTestId("work-order-list").innerText()).toContain("W-1001");
    await screenshot(writer, "first-week-12-work-orders-desktop");
    const foreman = await person(PHONE);
    await foreman.goto("/sign-in");
    await foreman.getByLabel("E-mail").fill("tom@harrow-creek.example");
    await foreman.getByLabel("Password").fill("tom-drives-the-plow");
    await foreman.getByRole("button", { name: "Sign in" }).click();
    await foreman.waitForURL((u) => u.pathname === "/fleet");
    await foreman.goto("/fleet/reports");
    await foreman.getByTestId("report-status").getByText("Checked in at the shop on W-1001").waitFor();
    expect(await foreman.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(foreman, "first-week-13-reports-foreman-phone");
  });

  it("the foreman forgets his password: a link by e-mail, a new password he chooses, and the old one stops working", async () => {
    const phone = await person(PHONE);
    await phone.goto("/sign-in");
    await phone.getByRole("link", { name: "Forgot your password?" }).click();
    await phone.waitForURL(/\/forgot-password$/);
    await phone.getByLabel("E-mail").fill("tom@harrow-creek.example");
    await phone.getByRole("button", { name: "Send me a link" }).click();
    await phone.getByRole("status").getByText("a link to choose a new password is on its way").waitFor();
    const mail = await mailTo("tom@harrow-creek.example", /password reset/i);
    await phone.goto(linkIn(mail, "/reset-password/"));
    await phone.getByLabel("Choose a password").waitFor();
    await expectNoSeriousViolations(phone, "/reset-password/[token]");
    await screenshot(phone, "first-week-14-reset-foreman-phone");
    await phone.getByLabel("Choose a password").fill("tom-plows-again-2026");
    await phone.getByLabel("The same password again").fill("tom-plows-again-2026");
    await phone.getByRole("button", { name: "Save the new password" }).click();
    await phone.waitForURL((u) => u.pathname === "/fleet");
    // The old password no longer signs in.
    const other = await person(PHONE);
    await other.goto("/sign-in");
    await other.getByLabel("E-mail").fill("tom@harrow-creek.example");
    await other.getByLabel("Password").fill("tom-drives-the-plow");
    await other.getByRole("button", { name: "Sign in" }).click();
    await other.locator(ALERT).first().waitFor();
    expect(new URL(other.url()).pathname).toBe("/sign-in");
    for (const c of contexts) await c.close();
  });
});
