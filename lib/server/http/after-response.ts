import "server-only";
import { after } from "next/server";

/**
 * Runs work that may be slow and may fail without undoing anything (closing a
 * payment page at the payment service) after the response has gone out: the
 * one home for such work. It returns nothing to await on purpose, so no caller
 * can wait on it in one place and forget it in another; a failure is logged.
 * Outside a request (scripts, tests) it starts straight away. E-mail never goes
 * this way: it is queued in the change's own transaction (lib/server/mail/queue.ts).
 */
export function afterResponse(work: () => Promise<unknown>): void {
  const run = () => work().then(() => undefined, (error: unknown) => console.error("work after the response failed", error));
  try {
    after(run);
  } catch {
    // after() throws outside a request scope; `run` never rejects, so nothing is left unhandled.
    void run();
  }
}
