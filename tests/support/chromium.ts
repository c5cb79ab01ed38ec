import { existsSync } from "node:fs";
import { chromium, type Browser } from "playwright-core";

/** A phone, as technicians and approvers hold one: the viewport every phone-sized check uses. */
export const PHONE = { width: 390, height: 844 };

// Debian's Chromium: the binary itself avoids the wrapper script's warning.
const EXECUTABLE = ["/usr/lib/chromium/chromium", "/usr/bin/chromium"].find((p) => existsSync(p)) ?? "/usr/bin/chromium";

/** Debian's Chromium, headless, quiet; Playwright gives each launch a fresh, empty profile directory of its own. */
export async function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: EXECUTABLE,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--disable-background-networking",
      "--disable-component-update",
      "--no-first-run",
      "--disable-sync",
    ],
  });
}
