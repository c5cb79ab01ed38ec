// What a week of use turned up, checked as each role would on phone and desktop: the time box on
// a running clock, approving what fits, what a released visit shows, the estimate editor, and
// the small words. Other browser files share this server; this one changes only what it checks.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import path from "node:path";
import { firstValue, seriousViolations } from "./a11y/axe";
import { DESKTOP, PHONE, caughtMail, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function sql(statement: string, args: (string | number)[] = []) {
  const { client } = openDatabase(`file:${path.join(import.meta.dirname, "..", ".artifacts", "browser", "cotter.db")}`);
  try {
    return await client.execute({ sql: statement, args });
  } finally {
    client.close();
  }
}

/** Console errors and uncaught page errors, e.g. React's hydration error #418. */
function watchConsole(page: Page): string[] {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(e.message));
  return errors;
}

describe("the diagnosis time box on a running clock (T-9, W-1043)", () => {
  it("warns past 80 %, stops by itself at 100 % with nobody watching, and the writer asks for more in one step", async () => {
    const woId = await firstValue("SELECT id FROM work_orders WHERE number = 1043");
    const shop = await newContext(browser, PHONE);
    const tech = await shop.newPage();
    const errors = watchConsole(tech);
    await signIn(tech, "tech@quarry-road.example");
    await tech.goto(`/work-orders/${woId}`);
    const diag = tech.getByTestId("clock-line").filter({ hasText: "Diagnose no-start" });
    await diag.getByRole("button", { name: "Clock in" }).click();
    await diag.getByRole("button", { name: "Clock out" }).waitFor();
    // 1 h 42 min of 2.0 h: the warning is on the phone, with when the clock will stop.
    await expect.poll(() => diag.getByTestId("time-box").getAttribute("data-status")).toBe("warn");
    expect(await diag.getByTestId("time-box-warning").innerText()).toContain("The clock stops by itself at 2.0 h");
    expect(await diag.getByTestId("clocked").innerText()).toMatch(/^Clocked 1 h 42 min · running now 0 min$/);
    await screenshot(tech, "time-box-warning-tech-phone");

    // Hydration: the page drawn on the server while the clock runs is the page the browser draws.
    // The scripts are held back a few seconds, so a clock read twice would not match.
    await tech.route(/\/_next\/static\/chunks\/.*\.js$/, async (route) => {
      await new Promise((r) => setTimeout(r, 4_000));
      await route.continue();
    });
    errors.length = 0;
    await tech.reload();
    await diag.getByRole("button", { name: "Clock out" }).waitFor();
    await tech.waitForTimeout(1_500);
    await tech.unroute(/\/_next\/static\/chunks\/.*\.js$/);
    expect(errors.filter((e) => /418|hydrat|did not match/i.test(e)), errors.join("\n")).toEqual([]);

    // Nobody watches for 20 minutes: the stored stop time has passed. The page shows the truth.
    await sql("UPDATE time_entries SET started_at = ?, stop_at = ? WHERE work_order_id = ? AND ended_at IS NULL", [
      new Date(Date.now() - 19 * 60_000).toISOString(),
      new Date(Date.now() - 60_000).toISOString(),
      woId,
    ]);
    await tech.reload();
    await expect.poll(() => diag.getByTestId("time-box").getAttribute("data-status")).toBe("blocked");
    expect(await diag.getByTestId("time-box-stopped").innerText()).toContain("the clock stopped by itself at the time box");
    expect(await diag.getByTestId("time-box").innerText()).toContain("2 h of 2.0 h approved");
    await diag.getByRole("button", { name: "Clock in" }).click();
    await tech.getByRole("alert").filter({ hasText: "time box needs extending" }).waitFor();
    await screenshot(tech, "time-box-stopped-tech-phone");

    // The writer, at the desk, asks the customer for one more hour in one step.
    const desk = await newContext(browser, DESKTOP);
    const writer = await desk.newPage();
    await signIn(writer, "writer@quarry-road.example");
    await writer.goto(`/work-orders/${woId}`);
    const ask = writer.getByTestId("ask-for-more-time");
    await ask.getByLabel("More hours (tenths)").fill("1.0");
    await ask.getByLabel(/Why/).fill("Drain still unexplained after the fuse pull");
    await ask.getByRole("button", { name: "Ask the customer for more time" }).click();
    await writer.getByTestId("time-box-pending").waitFor();
    expect(await writer.getByTestId("time-box-pending").innerText()).toContain("1.0 h more asked of the customer");
    await screenshot(writer, "time-box-ask-writer-desktop");
    await expect
      .poll(async () => (await caughtMail()).some((m) => m.to.includes("supervisor@brennan-twp.example") && m.subject.includes("1.0 h more diagnosis time")), { timeout: 15_000 })
      .toBe(true);
    await desk.close();
    await shop.close();
  });
});

describe("approving what fits (W-1042, the township supervisor on a phone)", () => {
  it("offers the lines within his $5,000.00 limit, says which is left and why, and passes the rest to a colleague who can sign", async () => {
    const woId = await firstValue("SELECT id FROM work_orders WHERE number = 1042");
    const fleet = await newContext(browser, PHONE);
    const page = await fleet.newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await page.goto(`/fleet/work-orders/${woId}`);
    const panel = page.getByTestId("approve-what-fits");
    await panel.waitFor();
    const button = panel.getByTestId("approve-all");
    expect(await button.innerText()).toMatch(/^Approve the 9 that fit \(\$2,797\.40\)$/);
    expect(await panel.getByTestId("lines-left").innerText()).toContain(
      "“Moldboard and cutting-edge assembly, 11 ft reversible” ($5,640.00) is more than the $2,202.60 your signing limit leaves on this work order after the lines that fit.",
    );
    await screenshot(page, "approve-what-fits-supervisor-phone");
    await button.click();
    await page.getByTestId("approval-banner").filter({ hasText: "Approved 9 lines ($2,797.40)." }).waitFor();
    // One line is left: the panel says why and offers a colleague who can sign for it.
    await panel.getByText("None of these fit").waitFor();
    await panel.getByTestId("pass-on").click();
    await page.getByTestId("approval-banner").filter({ hasText: "Passed 1 line to Helen Vasquez" }).waitFor();
    await expect
      .poll(async () => (await caughtMail()).find((m) => m.to.includes("trustee@brennan-twp.example") && m.subject.includes("passed 1 line to you"))?.text ?? "", { timeout: 15_000 })
      .toContain(`/fleet/work-orders/${woId}#line-`);
    // Its own Approve button is still refused by the server, in two sentences.
    const moldboard = page.getByTestId("approval-line").filter({ hasText: "Moldboard" });
    await moldboard.getByRole("button", { name: "Approve" }).click();
    const refusal = await moldboard.getByTestId("refusal").innerText();
    expect(refusal).toMatch(/your signing limit is \$5,000\.00\. Another approver on your account/);
    await fleet.close();
  });

  it("a line past the repair budget is left with the budget named (the school district's Bus 22)", async () => {
    const woId = await firstValue("SELECT id FROM work_orders WHERE number = 1044");
    const fleet = await newContext(browser, PHONE);
    const page = await fleet.newPage();
    await signIn(page, "transport@alder-falls-schools.example");
    await page.goto(`/fleet/work-orders/${woId}`);
    const panel = page.getByTestId("approve-what-fits");
    await panel.waitFor();
    expect(await panel.innerText()).toContain("would pass the repair budget");
    await screenshot(page, "approve-what-fits-budget-approver-phone");
    await fleet.close();
  });
});

describe("a released visit shows what is true", () => {
  it("no signing limit “left” on a visit that takes no more decisions", async () => {
    const woId = await firstValue("SELECT id FROM work_orders WHERE number = 1001");
    const fleet = await newContext(browser, PHONE);
    const page = await fleet.newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await page.goto(`/fleet/work-orders/${woId}`);
    await page.getByTestId("visit-closed").waitFor();
    expect(await page.getByTestId("signing-left").count()).toBe(0);
    expect(await page.getByTestId("approve-all").count()).toBe(0);
    await fleet.close();
  });
});

describe("the estimate editor (writer, desktop; W-1050, loader LD-2)", () => {
  it("keeps the chosen rate, drops a labour rate when the line becomes a part, shows no price for 1.55 h, keeps Remove on its row, and says when nothing is left to send", async () => {
    const woId = await firstValue("SELECT id FROM work_orders WHERE number = 1050");
    const desk = await newContext(browser, DESKTOP);
    const page = await desk.newPage();
    await signIn(page, "writer@quarry-road.example");
    await page.goto(`/work-orders/${woId}`);
    await page.getByRole("button", { name: "+ Add a line to this concern" }).first().click();
    const form = page.getByTestId("line-form");
    const picker = form.getByLabel("Labour rate");
    const options = await picker.locator("option").allInnerTexts();
    const rate = options.find((o) => o.startsWith("Diagnosis"))!;
    await picker.selectOption({ label: rate });
    expect(await picker.evaluate((s: HTMLSelectElement) => s.selectedOptions[0]?.textContent)).toBe(rate);
    expect(await form.getByLabel("Rate ($/h)").inputValue()).toBe("155.00");
    await form.getByRole("button", { name: "Part", exact: true }).click();
    expect(await form.getByLabel("Unit price ($)").inputValue()).toBe("");
    await form.getByRole("button", { name: "Labour", exact: true }).click();
    await form.getByLabel("Hours (tenths)").fill("1.55");
    expect(await form.getByTestId("line-amount").innerText()).toBe("—");
    expect(await form.getByTestId("quantity-problem").innerText()).toContain("tenths of an hour");
    await screenshot(page, "estimate-editor-faults-writer-desktop");
    await form.getByRole("button", { name: "Cancel" }).click();

    const row = page.getByTestId("estimate-line").filter({ hasText: "Fan belt" });
    const edit = await row.getByRole("button", { name: "Edit" }).boundingBox();
    const remove = await row.getByRole("button", { name: "Remove" }).boundingBox();
    expect(Math.abs((edit?.y ?? 0) - (remove?.y ?? 1))).toBeLessThan(2);
    const send = page.getByTestId("send-estimate");
    if (await send.isDisabled()) expect(await send.innerText()).toBe("No draft lines to send");
    await desk.close();
  });
});

describe("words and layout on the phone", () => {
  it("the occurrence form says °F once; “Occurrence log” stays on one line in the navigation", async () => {
    const unitId = await firstValue("SELECT id FROM units WHERE unit_number = 'T-9'");
    const fleet = await newContext(browser, PHONE);
    const page = await fleet.newPage();
    await signIn(page, "foreman@brennan-twp.example");
    await page.goto(`/fleet/units/${unitId}/log`);
    const question = page.locator("fieldset").filter({ has: page.getByText("Outside temperature", { exact: true }) });
    expect(((await question.innerText()).match(/°F/g) ?? []).length).toBe(1);
    const nav = page.getByRole("navigation", { name: "Main" });
    const log = await nav.getByRole("link", { name: "Occurrence log" }).boundingBox();
    const units = await nav.getByRole("link", { name: "Units" }).boundingBox();
    expect(log?.height).toBe(units?.height);
    await fleet.close();
  });

  it("an invoice's labour line reads as hours at a rate", async () => {
    const invoiceId = await firstValue(
      "SELECT i.id FROM invoices i JOIN invoice_lines l ON l.invoice_id = i.id WHERE l.kind = 'labor' AND i.status <> 'void' AND i.account_id = (SELECT id FROM accounts WHERE name LIKE 'Brennan%') LIMIT 1",
    );
    const fleet = await newContext(browser, PHONE);
    const page = await fleet.newPage();
    await signIn(page, "clerk@brennan-twp.example");
    await page.goto(`/fleet/invoices/${invoiceId}`);
    const text = await page.locator("main").innerText();
    expect(text).toMatch(/Labour · \d+(\.\d)? h at \$\d{1,3}(,\d{3})*\.\d{2}\/h/);
    expect(text).not.toMatch(/Labour · \$[\d,.]+ each/);
    await fleet.close();
  });
});

describe("keyboard: every control reachable, with a visible focus ring", () => {
  async function tabThrough(page: Page, limit = 120) {
    const seen: { tag: string; name: string; ring: boolean }[] = [];
    for (let i = 0; i < limit; i += 1) {
      await page.keyboard.press("Tab");
      const f = await page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        if (!el || el === document.body) return null;
        const ringOf = (e: Element | null) => {
          if (!e) return false;
          const s = getComputedStyle(e);
          return (s.outlineStyle !== "none" && parseFloat(s.outlineWidth) >= 2) || s.boxShadow !== "none";
        };
        const hidden = el.classList.contains("sr-only");
        // A date or time input's calendar button takes focus inside the browser's own shadow tree: the
        // input is the active element but not :focus, and the ring is drawn on that button
        // (globals.css), where computed styles cannot reach; it counts as the input's ring.
        const pickerButton = el instanceof HTMLInputElement && /^(date|time|datetime-local)$/.test(el.type) && !el.matches(":focus");
        return { tag: el.tagName, name: (el.getAttribute("aria-label") ?? el.textContent ?? "").trim().slice(0, 40), ring: pickerButton || (hidden ? ringOf(el.closest("label")) : ringOf(el)) };
      });
      if (!f) continue;
      if (seen.length && seen[0]!.tag === f.tag && seen[0]!.name === f.name && seen.length > 3) break;
      seen.push(f);
    }
    return seen;
  }

  it.each([
    ["the approver's estimate (phone)", "supervisor@brennan-twp.example", PHONE, "SELECT '/fleet/work-orders/' || id FROM work_orders WHERE number = 1042"],
    ["the technician's work order (phone)", "tech@quarry-road.example", PHONE, "SELECT '/work-orders/' || id FROM work_orders WHERE number = 1043"],
    ["the finding form (phone)", "tech@quarry-road.example", PHONE, "SELECT '/work-orders/' || id || '/findings/new' FROM work_orders WHERE number = 1043"],
    ["the estimate editor (desktop)", "writer@quarry-road.example", DESKTOP, "SELECT '/work-orders/' || id FROM work_orders WHERE number = 1050"],
  ] as const)("%s", async (_what, as, viewport, query) => {
    const context = await newContext(browser, viewport);
    const page = await context.newPage();
    await signIn(page, as);
    await page.goto(await firstValue(query));
    await page.locator("main").waitFor();
    await page.waitForTimeout(500);
    const reached = await tabThrough(page);
    const noRing = reached.filter((r) => !r.ring);
    expect(noRing, JSON.stringify(noRing)).toEqual([]);
    // Everything a mouse could use, the keyboard reached.
    const controls = await page.evaluate(() =>
      Array.from(document.querySelectorAll<HTMLElement>("main a[href], main button:not([disabled]), main input:not([disabled]), main select:not([disabled]), main textarea:not([disabled])"))
        .filter((el) => el.getClientRects().length > 0 && el.tabIndex >= 0 && !(el as HTMLInputElement).type?.match(/^hidden$/)).length,
    );
    expect(reached.length).toBeGreaterThanOrEqual(controls);
    await context.close();
  });

  it("the full-size photo view has no serious or critical violations either, and Escape closes it", async () => {
    const unitId = await firstValue("SELECT id FROM units WHERE unit_number = 'T-14'");
    const fleet = await newContext(browser, PHONE);
    const page = await fleet.newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    await page.goto(`/fleet/units/${unitId}`);
    const thumb = page.getByTestId("photo-thumb").first();
    await thumb.waitFor();
    await page.getByRole("button", { name: /open full size/ }).first().focus();
    await page.keyboard.press("Enter");
    await page.getByTestId("photo-full").waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.keyboard.press("Escape");
    await page.getByTestId("photo-full").waitFor({ state: "detached" });
    await fleet.close();
  });
});
