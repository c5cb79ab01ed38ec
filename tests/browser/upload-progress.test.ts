// The upload progress bar shows real progress: the share of the photo's bytes that have gone,
// through the real upload SDK (@uploadthing/react) to the local upload fake.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PHONE, launch, newContext, screenshot, signIn } from "./helpers";

let browser: Browser;
let bigPhoto: string;
beforeAll(async () => {
  browser = await launch();
  // Noise does not compress: about 6 MB, under the 8 MB a photo may be.
  const width = 2400;
  const height = 1800;
  const noise = Buffer.alloc(width * height * 3);
  for (let i = 0; i < noise.length; i += 1) noise[i] = (i * 2654435761) >>> 24;
  const jpeg = await sharp(noise, { raw: { width, height, channels: 3 } }).jpeg({ quality: 100 }).toBuffer();
  bigPhoto = path.join(mkdtempSync(path.join(tmpdir(), "cotter-progress-")), "wheel-end-close-up.jpg");
  writeFileSync(bigPhoto, jpeg);
});
afterAll(async () => {
  await browser?.close();
});

async function openFindingForm(context: import("playwright-core").BrowserContext) {
  const page = await context.newPage();
  await signIn(page, "tech@quarry-road.example");
  await page.getByTestId("floor-card").filter({ hasText: "T-9" }).first().click();
  await page.getByRole("link", { name: "+ Add a finding" }).click();
  await page.getByRole("heading", { name: "Add a finding" }).waitFor();
  // Record every state the bar's words and value take, as a person watching would see them.
  await page.evaluate(() => {
    const seen: string[] = [];
    Reflect.set(window, "__progressSeen", seen);
    const look = () => {
      for (const li of Array.from(document.querySelectorAll("[data-testid=upload-progress] li"))) {
        const bar = li.querySelector("progress");
        const state = `${li.getAttribute("data-phase") ?? "?"}:${bar?.hasAttribute("value") ? bar.value : "-"}:${li.querySelector("[data-testid=upload-progress-words]")?.textContent ?? ""}`;
        if (seen.at(-1) !== state) seen.push(state);
      }
    };
    new MutationObserver(look).observe(document.body, { subtree: true, childList: true, characterData: true, attributes: true });
  });
  return page;
}

const seenOn = async (page: import("playwright-core").Page) => (await page.evaluate(() => Reflect.get(window, "__progressSeen"))) as string[];

describe("upload progress", () => {
  it("says what is really happening at each step: getting ready, the share sent, then cleaning — never a 0 % that sits", async () => {
    const context = await newContext(browser, PHONE);
    const page = await openFindingForm(context);
    await page.getByTestId("photo-input").setInputFiles(bigPhoto);
    await page.getByTestId("upload-progress").waitFor();
    await page.getByTestId("uploaded-photos").locator("img").waitFor({ timeout: 60_000 });
    const seen = await seenOn(page);
    const phases = seen.map((s) => s.split(":")[0]);
    expect(phases[0], seen.join(" | ")).toBe("preparing");
    expect(phases.at(-1), seen.join(" | ")).toBe("cleaning");
    expect(seen.find((s) => s.startsWith("preparing")), "no number while no byte has moved").toBe("preparing:-:Getting ready…");
    expect(seen.find((s) => s.startsWith("cleaning"))).toBe("cleaning:-:Sent. Cleaning the photo…");
    // The phases come in order and never go back.
    const order = ["preparing", "sending", "cleaning"];
    expect([...phases].sort((a, b) => order.indexOf(a!) - order.indexOf(b!))).toEqual(phases);
    await context.close();
  });

  it("on a phone's uplink the bar moves through the share of bytes sent, from the browser's own upload events", async () => {
    const context = await newContext(browser, PHONE);
    const page = await openFindingForm(context);
    // About 1.5 MB/s up, as on a phone (Chromium's own network emulation), not loopback.
    const cdp = await context.newCDPSession(page);
    await cdp.send("Network.enable");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 40, downloadThroughput: 5_000_000, uploadThroughput: 1_500_000 });
    await page.getByTestId("photo-input").setInputFiles(bigPhoto);
    await page.getByTestId("upload-progress").waitFor();
    await expect.poll(async () => (await seenOn(page)).filter((s) => s.startsWith("sending:")).length, { timeout: 30_000 }).toBeGreaterThanOrEqual(3);
    await screenshot(page, "upload-progress-tech-phone");
    await page.getByTestId("uploaded-photos").locator("img").waitFor({ timeout: 60_000 });
    const sent = (await seenOn(page)).filter((s) => s.startsWith("sending:")).map((s) => Number(s.split(":")[1]));
    expect(sent.filter((v) => v > 0 && v < 100).length, sent.join(", ")).toBeGreaterThanOrEqual(3);
    expect([...sent].sort((a, b) => a - b)).toEqual(sent);
    await context.close();
  });
});
