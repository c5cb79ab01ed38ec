import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { inject } from "vitest";
import type { CaughtMail } from "@/mocks/smtp/server";
import { launchChromium, PHONE } from "@/tests/support/chromium";
import { APP_MAILBOX, mailbox } from "@/tests/support/mailbox";

export { PHONE };
export const DESKTOP = { width: 1366, height: 900 };
export const DEMO_PASSWORD = "cotter-demo";

export function baseUrl(): string {
  return inject("baseUrl");
}

/** The browser every test drives (tests/support/chromium.ts). */
export const launch = launchChromium;

export async function newContext(browser: Browser, viewport = PHONE, base = baseUrl()): Promise<BrowserContext> {
  return browser.newContext({ viewport, baseURL: base, isMobile: viewport === PHONE, hasTouch: viewport === PHONE });
}

/** Signs in through the real sign-in page, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
}

const shots = path.join(import.meta.dirname, "..", ".artifacts", "screenshots");

/** Keeps a screenshot of what the test saw, for people to look at. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(shots, { recursive: true });
  await page.screenshot({ path: path.join(shots, `${name}.png`), fullPage: true });
}

/** What the shared app server has sent so far, newest first. */
export async function caughtMail(): Promise<CaughtMail[]> {
  return mailbox(inject("mailCatcher"), APP_MAILBOX).messages();
}
