import { and, count, eq, gte, isNull, sql } from "drizzle-orm";
import { getDb, writeTx, writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { passwordResets, users } from "@/db/schema";
import { RESETS_PER_HOUR, linkState, resetExpiry } from "@/lib/auth/link-policy";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import type { SessionUser } from "@/lib/auth/session-user";
import { generateLinkToken, sha256Hex } from "@/lib/auth/tokens";
import { HttpError, conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";

/**
 * Makes a reset link for the address if an active person signs in with it and
 * has not been sent too many this hour. Returns null otherwise; the caller
 * answers the same either way, so the answer never says whether the address exists.
 */
type ResetMade = { token: string; user: { id: string; name: string; email: string } };

export async function requestPasswordReset(email: string, notify?: InSameTx<ResetMade>): Promise<ResetMade | null> {
  const { token, hash } = generateLinkToken();
  return writeTxThen<ResetMade | null>(async (tx) => {
    const [user] = await tx
      .select({ id: users.id, name: users.name, email: users.email })
      .from(users)
      .where(and(eq(users.email, email), eq(users.active, true)))
      .limit(1);
    if (!user) return null;
    const now = new Date();
    const hourAgo = new Date(now.getTime() - 3_600_000).toISOString();
    const [recent] = await tx
      .select({ n: count() })
      .from(passwordResets)
      .where(and(eq(passwordResets.userId, user.id), gte(passwordResets.createdAt, hourAgo)));
    if ((recent?.n ?? 0) >= RESETS_PER_HOUR) return null;
    await tx.insert(passwordResets).values({ userId: user.id, tokenHash: hash, expiresAt: resetExpiry(now), createdAt: now.toISOString() });
    return { token, user };
  }, notify ? (tx, made) => (made ? notify(tx, made) : Promise.resolve()) : undefined);
}

/** Sets the password and raises the session version: every session signed in before ends at its next request. */
async function setPassword(tx: Tx, userId: string, passwordHash: string) {
  await tx
    .update(users)
    .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: nowIso() })
    .where(eq(users.id, userId));
}

/** Uses a reset link once: a new password, every other session ended, the person's other links spent. */
export async function completePasswordReset(token: string, password: string) {
  const passwordHash = await hashPassword(password);
  return writeTx(async (tx) => {
    const [row] = await tx
      .select({ id: passwordResets.id, userId: passwordResets.userId, expiresAt: passwordResets.expiresAt, usedAt: passwordResets.usedAt, email: users.email, name: users.name, role: users.role, active: users.active, accountId: users.accountId })
      .from(passwordResets)
      .innerJoin(users, eq(users.id, passwordResets.userId))
      .where(eq(passwordResets.tokenHash, sha256Hex(token)))
      .limit(1);
    if (!row || !row.active) throw new HttpError(404, "reset_not_found", "Not found", "This link is not valid. Ask for a new one from the sign-in page.");
    const state = linkState(row, new Date());
    if (state === "used") throw conflict("reset_used", "This link has already been used. Ask for a new one from the sign-in page if you need to.");
    if (state !== "usable") throw new HttpError(410, "reset_expired", "Link expired", "This link has expired (they last an hour). Ask for a new one from the sign-in page.");
    await setPassword(tx, row.userId, passwordHash);
    const at = nowIso();
    await tx.update(passwordResets).set({ usedAt: at }).where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)));
    await recordAudit(tx, { id: row.userId, name: row.name, role: row.role }, { action: "person.password_reset", entityType: "user", entityId: row.userId, accountId: row.accountId });
    return { email: row.email };
  });
}

/** A signed-in person changes their own password; the current one is required. */
export async function changeOwnPassword(user: SessionUser, current: string, next: string) {
  const passwordHash = await hashPassword(next);
  return writeTx(async (tx) => {
    const [row] = await tx.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, user.id)).limit(1);
    if (!row) throw notFound("Your sign-in");
    if (!(await verifyPassword(current, row.passwordHash))) {
      throw invalidInput([{ path: "currentPassword", message: "That is not your current password." }], "Your current password did not match.");
    }
    await setPassword(tx, user.id, passwordHash);
    await recordAudit(tx, user, { action: "person.password_changed", entityType: "user", entityId: user.id, accountId: user.accountId });
    return { email: user.email };
  });
}

/** The state of a reset link, for the page it opens (looked up by the token's hash only). */
export async function resetStateForToken(token: string) {
  const [row] = await getDb()
    .select({ expiresAt: passwordResets.expiresAt, usedAt: passwordResets.usedAt, email: users.email, active: users.active })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, sha256Hex(token)))
    .limit(1);
  if (!row || !row.active) return null;
  return { email: row.email, state: linkState(row, new Date()) };
}
