import { after } from "next/server";

/**
 * Runs work (sending e-mail) after the response has gone out, so a slow mail
 * server never slows a decision down. Outside a request (scripts, tests) it
 * runs straight away and the returned promise can be awaited.
 */
export function deliverLater(work: () => Promise<unknown>): Promise<void> {
  const run = () => work().then(() => undefined, (error: unknown) => console.error("deferred delivery failed", error));
  try {
    after(run);
    return Promise.resolve();
  } catch {
    return run();
  }
}
