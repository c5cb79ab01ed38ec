import { launchChromium, PHONE } from "../../support/chromium";
import { median } from "./report";

export interface LcpResult {
  /** Largest contentful paint of each load, ms from navigation start. */
  loads: number[];
  medianMs: number;
}

declare global {
  interface Window {
    __lcpMs?: number;
  }
}

/**
 * The page's largest contentful paint on a 390 px phone viewport in headless
 * Chromium, `loads` times, each in a fresh context (nothing cached), signed
 * in with `cookie` ("name=value", the session cookie). Read from the
 * browser's own `largest-contentful-paint` entries once the page has loaded.
 */
export async function measureLcp(url: string, cookie: string, loads = 5): Promise<LcpResult> {
  const [name, ...rest] = cookie.split("=");
  const browser = await launchChromium();
  const results: number[] = [];
  try {
    for (let i = 0; i < loads; i++) {
      const context = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true });
      await context.addCookies([{ name: name!, value: rest.join("="), url }]);
      const page = await context.newPage();
      await page.addInitScript(() => {
        new PerformanceObserver((list) => {
          for (const entry of list.getEntries()) window.__lcpMs = entry.startTime;
        }).observe({ type: "largest-contentful-paint", buffered: true });
      });
      const response = await page.goto(url, { waitUntil: "load" });
      // A sign-in page or a refusal paints fast too: only the page itself counts.
      if (!response?.ok() || new URL(page.url()).pathname !== new URL(url).pathname) throw new Error(`${url} answered ${response?.status()} at ${page.url()}`);
      // The last candidate is reported once painting settles; a short wait lets it arrive.
      await page.waitForTimeout(500);
      const lcp = await page.evaluate(() => window.__lcpMs ?? null);
      if (lcp === null) throw new Error(`no largest-contentful-paint entry for ${url}`);
      results.push(Math.round(lcp));
      await context.close();
    }
  } finally {
    await browser.close();
  }
  return { loads: results, medianMs: median(results) };
}
