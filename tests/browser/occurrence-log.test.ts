import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { DESKTOP, PHONE, caughtMail, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
let dashPhoto: string;
beforeAll(async () => {
  browser = await launch();
  // A small PNG standing in for a phone photo of the dash: a dark panel with one lit warning lamp.
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480"><rect width="640" height="480" fill="#2b2d2f"/>
    <circle cx="220" cy="240" r="90" fill="none" stroke="#9a9a92" stroke-width="10"/><circle cx="430" cy="240" r="40" fill="#e8c547"/></svg>`;
  dashPhoto = path.join(mkdtempSync(path.join(tmpdir(), "cotter-occurrence-")), "dash-lamp.png");
  writeFileSync(dashPhoto, await sharp(Buffer.from(svg)).png().toBuffer());
});
afterAll(async () => {
  await browser?.close();
});

interface UnitRow {
  id: string;
  unitNumber: string;
  workOrderId: string | null;
}

/** Ids the way a person would reach them, through the app's own API with the page's session. */
async function unitByNumber(page: Page, unitNumber: string): Promise<UnitRow> {
  const res = await page.request.get("/api/v1/units?limit=200");
  const body = (await res.json()) as { units: UnitRow[] };
  const unit = body.units.find((u) => u.unitNumber === unitNumber);
  if (!unit) throw new Error(`no unit ${unitNumber}`);
  return unit;
}

async function chartPoints(page: Page): Promise<number> {
  return Number(await page.getByTestId("occurrence-chart").first().getAttribute("data-points"));
}

/** The width the browser decoded the image at, once it has loaded (0 while it has not). */
async function loadedWidth(img: Locator): Promise<number> {
  return img.evaluate((el: HTMLImageElement) => (el.complete ? el.naturalWidth : 0));
}

async function noSidewaysScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
}

describe("occurrence log, in Chromium", () => {
  it("the township foreman logs a no-start on a phone; the technician sees it on the concern's chart without a reload", async () => {
    // The technician has T-9's work order open on the bench computer.
    const techContext = await newContext(browser, DESKTOP);
    const tech = await techContext.newPage();
    await signIn(tech, "tech@quarry-road.example");
    const t9 = await unitByNumber(tech, "T-9");
    await tech.goto(`/work-orders/${t9.workOrderId}`);
    await tech.getByTestId("concern-log-panel").waitFor();
    await tech.getByTestId("occurrence-chart").locator(".recharts-symbols").first().waitFor();
    const before = await chartPoints(tech);
    expect(before).toBeGreaterThanOrEqual(15);
    expect(await tech.getByTestId("pattern-headline").innerText()).toMatch(/after more than \d+\sh\sparked/);
    await screenshot(tech, "occurrence-chart-tech-desktop");
    // Marks the page: a reload would lose it.
    await tech.evaluate(() => Object.assign(window, { __stillTheSamePage: true }));

    // The foreman, on a phone, from the fleet home.
    const foremanContext = await newContext(browser, PHONE);
    const foreman = await foremanContext.newPage();
    await signIn(foreman, "foreman@brennan-twp.example");
    await foreman.getByTestId("fleet-watch-list").waitFor();
    await screenshot(foreman, "fleet-home-watch-list-foreman-phone");
    await foreman.getByTestId("watched-concern").filter({ hasText: "T-9" }).getByRole("link", { name: "Log an occurrence" }).click();
    await foreman.getByTestId("occurrence-form").waitFor();
    await noSidewaysScroll(foreman);
    expect(await foreman.locator("main").innerText()).toContain("outside temperature");

    await foreman.getByRole("button", { name: "Would not start" }).click();
    await foreman.getByLabel("Hours parked", { exact: true }).fill("13");
    // Below zero on a keypad without a minus key: the ± button, then the digits.
    await foreman.getByRole("button", { name: "Below zero: switch the minus sign" }).click();
    await foreman.keyboard.type("7");
    expect(await foreman.getByLabel("Outside temperature").inputValue()).toBe("−7");
    await foreman.getByLabel("Battery voltage").fill("11.8");
    await foreman.getByRole("button", { name: "No", exact: true }).click();
    await foreman.getByLabel("Anything else").fill("Browser test: jumped from the pickup");
    // A photo of the dash from the camera: it goes up at once, with progress, and comes back as a cleaned thumbnail.
    await foreman.getByTestId("occurrence-photo-camera").setInputFiles(dashPhoto);
    const preview = foreman.getByTestId("occurrence-photo").getByTestId("photo-thumb");
    await expect.poll(() => loadedWidth(preview)).toBe(320);
    await noSidewaysScroll(foreman);
    await screenshot(foreman, "occurrence-form-filled-foreman-phone");
    const posted = foreman.waitForResponse((r) => r.url().includes(`/api/v1/units/${t9.id}/occurrences`) && r.request().method() === "POST");
    await foreman.getByRole("button", { name: "Send to the shop" }).click();
    expect((await posted).status()).toBe(201);
    const entry = (await (await posted).json()) as { id: string; photo: { url: string; thumbUrl: string } | null };
    expect(entry.photo?.thumbUrl).toMatch(/^\/api\/v1\/photos\/[^/]+\/thumb$/);
    const sentAt = Date.now();
    await foreman.getByTestId("send-ok").waitFor();
    await screenshot(foreman, "occurrence-sent-foreman-phone");
    // The form is ready for the next one, and the entry is in the fleet's own log.
    expect(await foreman.getByLabel("Hours parked", { exact: true }).inputValue()).toBe("");
    await expect.poll(() => foreman.getByTestId("occurrence-row").first().innerText()).toContain("−7 °F");
    await expect.poll(() => loadedWidth(foreman.locator(`[data-testid="occurrence-row"][data-id="${entry.id}"] [data-testid="photo-thumb"]`))).toBe(320);
    expect(await foreman.getByTestId("occurrence-photo").getByTestId("photo-thumb").count()).toBe(0);

    // The technician's page picks it up by itself (it asks every LIVE_REFRESH_MS, 2.5 s, inside the 5 s the issue asks).
    expect(LIVE_REFRESH_MS).toBeLessThanOrEqual(2_500);
    await expect.poll(() => chartPoints(tech), { timeout: 30_000 }).toBe(before + 1);
    // Measured, not asserted (speed belongs to benchmarks): how long the new mark took to appear.
    console.log(`occurrence appeared on the technician's chart ${Date.now() - sentAt} ms after the POST answered`);
    expect(await tech.evaluate(() => (window as unknown as { __stillTheSamePage?: boolean }).__stillTheSamePage)).toBe(true);
    // The list under the chart (folded away once it is long) has the new entry too.
    expect(await tech.getByTestId("occurrence-list").textContent()).toContain("Browser test: jumped from the pickup");
    await screenshot(tech, "occurrence-chart-after-tech-desktop");
    // The foreman's photo is on the new entry: a thumbnail in the shop's list, full size on a tap.
    const log = tech.getByTestId("concern-log-panel").locator("details");
    if ((await log.getAttribute("open")) === null) await log.locator("summary").click();
    const row = tech.locator(`[data-testid="occurrence-row"][data-id="${entry.id}"]`);
    await expect.poll(() => loadedWidth(row.getByTestId("photo-thumb"))).toBe(320);
    await row.scrollIntoViewIfNeeded();
    await screenshot(tech, "occurrence-list-photo-tech-desktop");
    await row.getByTestId("photo-thumb").click();
    await expect.poll(() => loadedWidth(tech.getByTestId("photo-full"))).toBe(640);
    await screenshot(tech, "occurrence-photo-full-tech-desktop");
    await tech.getByRole("button", { name: "Close" }).click();

    // The writer and the technician were e-mailed, with a link straight to the concern.
    await expect.poll(async () => (await caughtMail()).filter((m) => m.text.includes("Browser test: jumped")).flatMap((m) => m.to).sort()).toEqual([
      "tech@quarry-road.example",
      "writer@quarry-road.example",
    ]);
    const mail = (await caughtMail()).find((m) => m.text.includes("Browser test: jumped"));
    expect(mail?.text).toMatch(/\/concerns\/[0-9a-z]+/);
    await foremanContext.close();
    await techContext.close();
  });

  it("a lost signal keeps the entry: the form says so, keeps every value, and survives a reload", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, "supervisor@brennan-twp.example");
    const t9 = await unitByNumber(page, "T-9");
    await page.goto(`/fleet/units/${t9.id}/log`);
    await page.getByTestId("occurrence-form").waitFor();
    await page.getByRole("button", { name: "Cranked slowly" }).click();
    await page.getByRole("button", { name: "Weekend, 60 h" }).click();
    await page.getByLabel("Outside temperature").fill("19");
    await page.getByLabel("Anything else").fill("Sent with no signal");
    await page.getByTestId("occurrence-photo-input").setInputFiles(dashPhoto);
    await expect.poll(() => loadedWidth(page.getByTestId("occurrence-photo").getByTestId("photo-thumb"))).toBe(320);

    await context.setOffline(true);
    await page.getByRole("button", { name: "Send to the shop" }).click();
    await page.getByTestId("send-failed").waitFor();
    expect(await page.getByTestId("send-failed").innerText()).toContain("kept on this phone");
    expect(await page.getByLabel("Hours parked", { exact: true }).inputValue()).toBe("60");
    expect(await page.getByLabel("Outside temperature").inputValue()).toBe("19");
    // "Just now" has become the time of the first attempt, so a later retry is still dated right.
    expect(await page.getByLabel("Date and time it happened").inputValue()).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d$/);
    await screenshot(page, "occurrence-send-failed-phone");

    await context.setOffline(false);
    await page.reload();
    await page.getByTestId("draft-restored").waitFor();
    expect(await page.getByLabel("Anything else").inputValue()).toBe("Sent with no signal");
    expect(await page.getByRole("button", { name: "Cranked slowly" }).getAttribute("aria-pressed")).toBe("true");
    // The photo was uploaded before the signal went; the kept draft still names it.
    await expect.poll(() => loadedWidth(page.getByTestId("occurrence-photo").getByTestId("photo-thumb"))).toBe(320);
    const resent = page.waitForResponse((r) => r.url().includes(`/api/v1/units/${t9.id}/occurrences`) && r.request().method() === "POST");
    await page.getByRole("button", { name: "Send to the shop" }).click();
    expect(((await (await resent).json()) as { photo: unknown }).photo).not.toBeNull();
    await page.getByTestId("send-ok").waitFor();
    expect(await page.evaluate((id) => window.localStorage.getItem(`cotter:occurrence-draft:${id}`), t9.id)).toBeNull();
    await context.close();
  });

  it("a still from a short video: the foreman picks the moment on the phone, and only that frame is sent", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, "foreman@brennan-twp.example");
    const t9 = await unitByNumber(page, "T-9");
    await page.goto(`/fleet/units/${t9.id}/log`);
    await page.getByTestId("occurrence-form").waitFor();
    // A short clip of a flashing lamp, recorded by this browser's own encoder (WebM), stands in for the phone's video.
    const clip = await page.evaluate(async () => {
      const canvas = document.createElement("canvas");
      canvas.width = 320;
      canvas.height = 240;
      const ctx = canvas.getContext("2d");
      const recorder = new MediaRecorder(canvas.captureStream(15), { mimeType: "video/webm" });
      const chunks: Blob[] = [];
      recorder.ondataavailable = (e) => chunks.push(e.data);
      const stopped = new Promise((resolve) => (recorder.onstop = resolve));
      let frame = 0;
      const draw = () => {
        if (!ctx) return;
        ctx.fillStyle = "#2b2d2f";
        ctx.fillRect(0, 0, 320, 240);
        ctx.fillStyle = frame % 4 < 2 ? "#e8c547" : "#55524a";
        ctx.beginPath();
        ctx.arc(160, 120, 50, 0, Math.PI * 2);
        ctx.fill();
        frame += 1;
      };
      draw();
      recorder.start(100);
      const timer = setInterval(draw, 66);
      await new Promise((resolve) => setTimeout(resolve, 1_200));
      clearInterval(timer);
      recorder.stop();
      await stopped;
      const bytes = new Uint8Array(await new Blob(chunks).arrayBuffer());
      let binary = "";
      for (const b of bytes) binary += String.fromCharCode(b);
      return btoa(binary);
    });
    await page.getByRole("button", { name: "Warning lamp came on" }).click();
    // A note saved as .jpg is refused on the phone, and Send is free again.
    await page.getByTestId("occurrence-photo-input").setInputFiles({ name: "lamp-notes.jpg", mimeType: "image/jpeg", buffer: Buffer.from("Amber lamp, then nothing\n") });
    await expect.poll(() => page.getByTestId("photo-problems").textContent()).toContain("lamp-notes.jpg is not a JPEG, PNG, WebP or HEIC photo");
    expect(await page.getByRole("button", { name: "Send to the shop" }).isEnabled()).toBe(true);
    const registered = page.waitForRequest((r) => r.url().includes("/api/uploadthing") && r.method() === "POST");
    await page.getByTestId("occurrence-photo-input").setInputFiles({ name: "dash-lamp.webm", mimeType: "video/webm", buffer: Buffer.from(clip, "base64") });
    const picker = page.getByTestId("video-still-picker");
    await picker.waitFor();
    // The entry waits for the moment to be picked rather than going without it.
    expect(await page.getByRole("button", { name: "Waiting for the photo…" }).isDisabled()).toBe(true);
    await noSidewaysScroll(page);
    await screenshot(page, "occurrence-video-still-foreman-phone");
    await picker.getByRole("button", { name: "Use this moment" }).click();
    // What went up is one JPEG frame, not the video.
    const files = (JSON.parse((await registered).postData() ?? "{}") as { files?: { name: string; type: string }[] }).files;
    expect(files).toEqual([expect.objectContaining({ name: "dash-lamp-still.jpg", type: "image/jpeg" })]);
    await expect.poll(() => loadedWidth(page.getByTestId("occurrence-photo").getByTestId("photo-thumb"))).toBe(320);
    const posted = page.waitForResponse((r) => r.url().includes(`/api/v1/units/${t9.id}/occurrences`) && r.request().method() === "POST");
    await page.getByRole("button", { name: "Send to the shop" }).click();
    const entry = (await (await posted).json()) as { id: string; photo: { url: string } | null };
    expect(entry.photo).not.toBeNull();
    const full = await page.request.get(entry.photo?.url ?? "");
    expect(full.headers()["content-type"]).toBe("image/jpeg");
    expect((await sharp(await full.body()).metadata()).width).toBe(320);
    await context.close();
  });

  it("the shop marks a concern intermittent, the fleet sees what to record, and then the shop's conclusion", async () => {
    const writerContext = await newContext(browser, DESKTOP);
    const writer = await writerContext.newPage();
    await signIn(writer, "writer@quarry-road.example");
    const t14 = await unitByNumber(writer, "T-14");
    await writer.goto(`/work-orders/${t14.workOrderId}`);
    const form = writer.getByTestId("mark-intermittent-form");
    await form.getByRole("combobox").selectOption({ label: "Plow drifts down overnight with the valve in hold." });
    await form.getByRole("textbox").fill("Note how long it sat and how far the blade dropped, in inches.");
    await form.getByRole("button", { name: /Mark intermittent/ }).click();
    await writer.getByTestId("intermittent-concern").filter({ hasText: "Plow drifts down" }).waitFor();

    const fleetContext = await newContext(browser, PHONE);
    const fleet = await fleetContext.newPage();
    await signIn(fleet, "supervisor@brennan-twp.example");
    await fleet.goto(`/fleet/units/${t14.id}`);
    const watch = fleet.getByTestId("fleet-watch-list");
    expect(await watch.innerText()).toContain("how far the blade dropped");
    await screenshot(fleet, "fleet-unit-watch-supervisor-phone");

    const concern = writer.getByTestId("intermittent-concern").filter({ hasText: "Plow drifts down" });
    await concern.getByText("Cause found: close this concern").click();
    await concern.getByTestId("close-concern-form").getByRole("textbox").fill("Lift cylinder piston seals bypassing; resealed and held overnight with no drift.");
    await concern.getByRole("button", { name: "Close the concern" }).click();
    await concern.getByTestId("concern-conclusion").waitFor();

    await fleet.goto(`/fleet/units/${t14.id}/log`);
    await fleet.getByTestId("fleet-conclusion").waitFor();
    expect(await fleet.getByTestId("fleet-conclusion").innerText()).toContain("resealed");
    await noSidewaysScroll(fleet);
    await screenshot(fleet, "fleet-conclusion-supervisor-phone");
    await fleetContext.close();
    await writerContext.close();
  });

  it("another account never sees the township's log (404), and the technician's concern page works on a phone", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, "tech@quarry-road.example");
    const t9 = await unitByNumber(page, "T-9");
    const log = (await (await page.request.get(`/api/v1/units/${t9.id}/occurrences`)).json()) as { concerns: { id: string }[] };
    await page.goto(`/concerns/${log.concerns[0]!.id}`);
    await page.getByTestId("occurrence-chart").locator(".recharts-symbols").first().waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, "concern-page-tech-phone");
    // The shop's unit page lists the open intermittent concern with its pattern, linking to this page.
    await page.goto(`/units/${t9.id}`);
    const onUnit = page.getByTestId("unit-intermittent-concerns");
    expect(await onUnit.innerText()).toMatch(/after more than \d+\sh\sparked/);
    await onUnit.getByRole("link", { name: /Cranks slowly/ }).click();
    await page.waitForURL(/\/concerns\//);
    await context.close();

    const other = await newContext(browser, PHONE);
    const bus = await other.newPage();
    await signIn(bus, "transport@alder-falls-schools.example");
    expect((await bus.request.get(`/api/v1/units/${t9.id}/occurrences`)).status()).toBe(404);
    await bus.goto(`/fleet/units/${t9.id}/log`);
    await bus.getByRole("heading", { name: "Not found" }).waitFor();
    expect(await bus.locator("body").innerText()).not.toContain("T-9");
    await bus.goto("/fleet/occurrences");
    const text = (await bus.locator("main").textContent()) ?? "";
    expect(text).toContain("Bus 14");
    expect(text).not.toContain("T-9");
    await screenshot(bus, "fleet-occurrences-schools-phone");
    await other.close();
  });
});
