import "server-only";
import { after } from "next/server";

/**
 * Runs work that may be slow and may fail without undoing anything (closing a
 * payment page at the payment service) after the response has gone out.
 * Outside a request (scripts, tests) it runs straight away. E-mail never goes
 * this way: it is queued in the change's own transaction (lib/server/mail/queue.ts).
 */
export function afterResponse(work: () => Promise<unknown>): Promise<void> {
  const run = () => work().then(() => undefined, (error: unknown) => console.error("work after the response failed", error));
  try {
    after(run);
    return Promise.resolve();
  } catch {
    return run();
  }
}
