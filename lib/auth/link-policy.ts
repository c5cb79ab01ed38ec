/**
 * How long e-mailed links last, and what state a link is in. Pure: the clock
 * is passed in. Invitations wait a week (people are away); a reset link
 * lasts an hour (it opens an account to whoever holds the mailbox).
 */
export const INVITATION_DAYS = 7;
export const RESET_MINUTES = 60;
/** Reset links one address may be sent per hour; more are quietly not sent. */
export const RESETS_PER_HOUR = 3;

export function invitationExpiry(now: Date): string {
  return new Date(now.getTime() + INVITATION_DAYS * 86_400_000).toISOString();
}

export function resetExpiry(now: Date): string {
  return new Date(now.getTime() + RESET_MINUTES * 60_000).toISOString();
}

export type LinkState = "usable" | "used" | "expired" | "withdrawn";

export function linkState(row: { expiresAt: string; usedAt: string | null; withdrawnAt?: string | null }, now: Date): LinkState {
  if (row.usedAt) return "used";
  if (row.withdrawnAt) return "withdrawn";
  // The link works up to its expiry instant and not at it.
  if (Date.parse(row.expiresAt) <= now.getTime()) return "expired";
  return "usable";
}
