/**
 * When a message that could not be sent is tried again: soon at first (a
 * mail server restarting), then further apart, for about four hours in all;
 * after that it is marked failed and waits for a person on the Outgoing mail
 * page. Pure.
 */
const DELAYS_MS = [5_000, 30_000, 2 * 60_000, 10 * 60_000, 30 * 60_000, 60 * 60_000, 2 * 60 * 60_000];

export const MAX_ATTEMPTS = DELAYS_MS.length + 1;

/** The wait after the given number of failed attempts, or null when it is time to give up. */
export function retryDelayMs(failedAttempts: number): number | null {
  if (failedAttempts >= MAX_ATTEMPTS) return null;
  return DELAYS_MS[Math.max(0, failedAttempts - 1)] ?? null;
}
