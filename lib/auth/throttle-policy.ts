/**
 * How hard to push back on repeated failed sign-ins. Failures are counted in
 * the database (so several app instances agree), twice: per account (the
 * e-mail typed, whether or not it exists) and per client address. The account
 * count is what locks: a locked account gets the same answer whichever address
 * asks, and a forged address changes nothing. The address count is set much
 * higher, so one office behind one address cannot lock its own people out,
 * while a script trying many accounts from one place still crawls.
 */
export const THROTTLE_WINDOW_MINUTES = 15;
const MAX_DELAY_MS = 8_000;

export const ACCOUNT_LIMITS = { free: 3, lockAfter: 10 } as const;
export const ADDRESS_LIMITS = { free: 10, lockAfter: 50 } as const;

export interface FailureCount {
  failures: number;
  /** ms since the oldest failure counted */
  msSinceOldest: number;
}

export type ThrottleVerdict =
  | { kind: "allow"; delayMs: number }
  | { kind: "locked"; scope: "account" | "address"; retryAfterMinutes: number };

function one(count: FailureCount, limits: { free: number; lockAfter: number }): { locked: boolean; retryAfterMinutes: number; delayMs: number } {
  const left = THROTTLE_WINDOW_MINUTES * 60_000 - count.msSinceOldest;
  const retryAfterMinutes = Math.max(1, Math.ceil(left / 60_000));
  if (count.failures >= limits.lockAfter) return { locked: true, retryAfterMinutes, delayMs: 0 };
  if (count.failures < limits.free) return { locked: false, retryAfterMinutes, delayMs: 0 };
  // 1 s, 2 s, 4 s, then 8 s: a person barely notices, a guessing script crawls.
  return { locked: false, retryAfterMinutes, delayMs: Math.min(MAX_DELAY_MS, 1000 * 2 ** (count.failures - limits.free)) };
}

export function throttleVerdict(account: FailureCount, address: FailureCount = { failures: 0, msSinceOldest: 0 }): ThrottleVerdict {
  const a = one(account, ACCOUNT_LIMITS);
  if (a.locked) return { kind: "locked", scope: "account", retryAfterMinutes: a.retryAfterMinutes };
  const b = one(address, ADDRESS_LIMITS);
  if (b.locked) return { kind: "locked", scope: "address", retryAfterMinutes: b.retryAfterMinutes };
  return { kind: "allow", delayMs: Math.max(a.delayMs, b.delayMs) };
}

const minutes = (n: number) => `${n} minute${n === 1 ? "" : "s"}`;

/** What the sign-in form says; the account message never depends on who asks or whether the account exists. */
export function lockedMessage(verdict: Extract<ThrottleVerdict, { kind: "locked" }>): string {
  return verdict.scope === "account"
    ? `Too many failed sign-ins for this account. Try again in ${minutes(verdict.retryAfterMinutes)}, or ask the shop to reset your password.`
    : `Too many failed sign-ins from this network. Try again in ${minutes(verdict.retryAfterMinutes)}.`;
}
