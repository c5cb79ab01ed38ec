import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { caughtMail, DESKTOP, launch, newContext, PHONE, screenshot, signIn } from "./helpers";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function addLine(page: Page, line: { kind: "Labour" | "Part"; description: string; quantity: string; price: string }) {
  await page.getByRole("button", { name: "+ Add a line to this concern" }).first().click();
  const form = page.getByTestId("line-form");
  await form.getByRole("button", { name: line.kind, exact: true }).click();
  await form.getByLabel("Description").fill(line.description);
  await form.getByLabel(line.kind === "Labour" ? "Hours (tenths)" : "Quantity").fill(line.quantity);
  await form.getByLabel(line.kind === "Labour" ? "Rate ($/h)" : "Unit price ($)").fill(line.price);
  await form.getByRole("button", { name: "Add line" }).click();
  await page.getByTestId("estimate-line").filter({ hasText: line.description }).waitFor();
}

describe("estimate → decisions, across the shop and the fleet", () => {
  it("the writer builds and sends an estimate; the supervisor decides line by line on a phone; the writer sees the decisions", async () => {
    // The writer, on a desktop, prices the cold-start work on T-9.
    const shop = await newContext(browser, DESKTOP);
    const writer = await shop.newPage();
    await signIn(writer, "writer@quarry-road.example");
    await writer.getByTestId("floor-card").filter({ hasText: "T-9" }).filter({ hasText: "No-start" }).click();
    await writer.getByRole("heading", { name: /T-9/ }).waitFor();
    const workOrderUrl = writer.url();

    await addLine(writer, { kind: "Part", description: "Group 31 battery, pair", quantity: "2", price: "194.95" });
    await addLine(writer, { kind: "Labour", description: "Repair chafed starter cable", quantity: "1.2", price: "142.50" });
    await addLine(writer, { kind: "Part", description: "Block heater cord", quantity: "1", price: "64.50" });
    await addLine(writer, { kind: "Part", description: "Remanufactured starter and mounting kit", quantity: "1", price: "5200.00" });
    // Live pricing: 2 × $194.95 = $389.90 shows on the line.
    expect(await writer.getByTestId("estimate-line").filter({ hasText: "Group 31 battery" }).textContent()).toContain("$389.90");
    await writer.getByTestId("send-estimate").click();
    await writer.getByText(/Sent 4 lines to Brennan Township Highway Department/).waitFor();
    await screenshot(writer, "estimate-editor-writer-desktop");

    // The e-mail carries the link the supervisor opens.
    let link = "";
    await expect
      .poll(async () => {
        const mail = (await caughtMail()).find((m) => m.to.includes("supervisor@brennan-twp.example") && m.subject.includes("T-9"));
        link = mail?.text.match(/https?:\/\/\S+\/fleet\/work-orders\/\S+/)?.[0] ?? "";
        return link;
      }, { timeout: 15_000 })
      .not.toBe("");

    const fleet = await newContext(browser, PHONE);
    const supervisor = await fleet.newPage();
    await signIn(supervisor, "supervisor@brennan-twp.example");
    await supervisor.goto(new URL(link).pathname);
    await supervisor.getByTestId("limits").waitFor();
    const line = (text: string) => supervisor.getByTestId("approval-line").filter({ hasText: text });

    await line("Group 31 battery").getByRole("button", { name: "Approve" }).click();
    await expect.poll(() => line("Group 31 battery").getAttribute("data-state")).toBe("approved");
    await line("starter cable").getByRole("button", { name: "Decline" }).click();
    await expect.poll(() => line("starter cable").getAttribute("data-state")).toBe("declined");
    await line("Block heater cord").getByRole("button", { name: "Hold for later" }).click();
    await expect.poll(() => line("Block heater cord").getAttribute("data-state")).toBe("held");

    // He approved the $310.00 diagnosis earlier (demo data) and $389.90 now;
    // $5,200.00 more would make $5,899.90, over his $5,000.00 limit.
    await line("Remanufactured starter").getByRole("button", { name: "Approve" }).click();
    const refusal = line("Remanufactured starter").getByTestId("refusal");
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(/approving \$5,200\.00 would bring your approvals on W-1043 to \$5,899\.90; your signing limit is \$5,000\.00/i);
    expect(await line("Remanufactured starter").getAttribute("data-state")).toBe("proposed");
    expect(await supervisor.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(supervisor, "approval-supervisor-phone");
    // On the phone the decision log is a list that leads with decision and amount, not a wide table.
    const phoneLog = supervisor.getByTestId("decision-log-list");
    await phoneLog.scrollIntoViewIfNeeded();
    expect(await phoneLog.isVisible()).toBe(true);
    expect(await supervisor.getByTestId("decision-log").isVisible()).toBe(false);
    for (const d of ["Approve", "Decline", "Hold for later"]) expect(await phoneLog.textContent()).toContain(d);

    // Back at the shop, the decisions are on the work order for the writer.
    await writer.goto(workOrderUrl);
    const log = writer.getByTestId("decision-log");
    await log.waitFor();
    const text = (await log.textContent()) ?? "";
    expect(text).toContain("Gary Holm");
    for (const d of ["Approve", "Decline", "Hold for later"]) expect(text).toContain(d);
    await screenshot(writer, "decisions-writer-desktop");
    await shop.close();
    await fleet.close();
  });
});
