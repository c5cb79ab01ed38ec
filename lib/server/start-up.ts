import "server-only";
import { env } from "@/lib/env";
import { installSocketAddressStamp } from "@/lib/server/http/client-address";
import { startMailWorker } from "@/lib/server/mail/worker";

/**
 * Runs once when the server starts (instrumentation.ts), before it answers
 * anyone. A bad environment stops the process here with a message that names
 * each variable, rather than on somebody's first request.
 */
export async function startUp(): Promise<void> {
  try {
    env();
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  }
  await installSocketAddressStamp();
  // Mail queued before a restart goes out now, without waiting for new mail to be queued.
  startMailWorker();
}
