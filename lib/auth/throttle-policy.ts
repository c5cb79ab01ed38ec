/**
 * How hard to push back on repeated failed sign-ins from one address.
 * Counting happens in the database (so several app instances agree); this
 * decides what the count means.
 */
export const THROTTLE_WINDOW_MINUTES = 15;
const FREE_ATTEMPTS = 3;
const MAX_DELAY_MS = 8_000;
const LOCK_AFTER = 10;

export type ThrottleVerdict = { kind: "allow"; delayMs: number } | { kind: "locked"; retryAfterMinutes: number };

/** failures: failed attempts from this address inside the window; oldestAt: ms since the oldest of them. */
export function throttleVerdict(failures: number, msSinceOldest: number): ThrottleVerdict {
  if (failures >= LOCK_AFTER) {
    const left = THROTTLE_WINDOW_MINUTES * 60_000 - msSinceOldest;
    return { kind: "locked", retryAfterMinutes: Math.max(1, Math.ceil(left / 60_000)) };
  }
  if (failures < FREE_ATTEMPTS) return { kind: "allow", delayMs: 0 };
  // 1 s, 2 s, 4 s, then 8 s: a person barely notices, a guessing script crawls.
  return { kind: "allow", delayMs: Math.min(MAX_DELAY_MS, 1000 * 2 ** (failures - FREE_ATTEMPTS)) };
}
