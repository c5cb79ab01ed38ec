import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DESKTOP, PHONE, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("sign-in and the first screens, in Chromium", () => {
  it("the township supervisor, on a phone, sees only the township's units, in-shop first", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await expect.poll(() => page.url()).toContain("/fleet");
    await page.getByRole("heading", { name: "Your units" }).waitFor();
    const body = (await page.locator("main").textContent()) ?? "";
    expect(body).toContain("Brennan Township Highway Department");
    for (const township of ["T-14", "T-9", "L-3", "T-21"]) expect(body).toContain(township);
    for (const other of ["Bus 22", "Haul 7", "Loader 2", "Kettle Ridge", "Alder Falls School"]) expect(body).not.toContain(other);
    // Units in the shop come first, with their status in words.
    // (Other browser tests share this server and move units along, so count rather than name statuses.)
    const inShop = await page.getByTestId("fleet-unit-in-shop").count();
    expect(inShop).toBeGreaterThanOrEqual(3);
    expect(body.indexOf("In the shop")).toBeLessThan(body.indexOf("Not in the shop"));
    // Every unit in the shop shows its live status in words.
    expect(await page.getByTestId("fleet-unit-in-shop").locator("[data-status]").count()).toBe(inShop);
    // Nothing is wider than the phone.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, "fleet-home-supervisor-phone");

    // A unit waiting on parts opens its unit page (one waiting on approval opens the estimate).
    await page.getByTestId("fleet-unit-in-shop").filter({ hasText: "L-3" }).click();
    await page.getByRole("heading", { name: "Unit L-3" }).waitFor();
    expect(await page.locator("main").innerText()).toContain("Visits");
    await screenshot(page, "fleet-unit-supervisor-phone");
    await context.close();
  });

  it("the technician signs in and sees the Floor, with their own work first", async () => {
    const context = await newContext(browser, DESKTOP);
    const page = await context.newPage();
    await signIn(page, "tech@quarry-road.example");
    await expect.poll(() => page.url()).toContain("/floor");
    await page.getByRole("heading", { name: "Floor", exact: true }).waitFor();
    await page.getByRole("heading", { name: /Assigned to you/ }).waitFor();
    expect(await page.getByTestId("floor-card").count()).toBeGreaterThanOrEqual(9);
    const text = await page.locator("main").innerText();
    for (const account of ["Brennan Township Highway Department", "Alder Falls School District Transportation", "Kettle Ridge Stone Co."]) {
      expect(text).toContain(account);
    }
    await screenshot(page, "floor-tech-desktop");
    await context.close();
  });

  it("a fleet user who opens a shop URL is turned away", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, "foreman@brennan-twp.example");
    const response = await page.goto("/floor");
    expect(response?.status()).toBe(403);
    await page.getByRole("heading", { name: "This page is for shop staff" }).waitFor();
    expect(await page.locator("body").innerText()).not.toContain("Kettle Ridge");
    await screenshot(page, "turned-away-foreman-phone");
    await context.close();
  });

  it("a wrong password gets a clear message and no session", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill("clerk@brennan-twp.example");
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect.poll(() => page.locator("form").getByRole("alert").textContent()).toContain("do not match an account");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await context.close();
  });

  it("an e-mailed deep link survives sign-in", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await page.goto("/fleet");
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel("E-mail").fill("clerk@brennan-twp.example");
    await page.getByLabel("Password").fill("cotter-demo");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => url.pathname === "/fleet");
    await context.close();
  });
});
