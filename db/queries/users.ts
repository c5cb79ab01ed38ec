import { and, count, eq, gte, isNull, min } from "drizzle-orm";
import { getDb } from "@/db/client";
import { apiTokens, signInFailures, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { nowIso } from "@/lib/ids";

const sessionColumns = {
  id: users.id,
  name: users.name,
  email: users.email,
  role: users.role,
  accountId: users.accountId,
  signingLimitCents: users.signingLimitCents,
};

export async function findActiveUser(id: string): Promise<(Omit<SessionUser, "via"> & { sessionVersion: number }) | null> {
  const [row] = await getDb()
    .select({ ...sessionColumns, sessionVersion: users.sessionVersion })
    .from(users)
    .where(and(eq(users.id, id), eq(users.active, true)))
    .limit(1);
  return row ?? null;
}

export async function findUserForSignIn(email: string) {
  const [row] = await getDb()
    .select({ ...sessionColumns, passwordHash: users.passwordHash, active: users.active, sessionVersion: users.sessionVersion })
    .from(users)
    .where(eq(users.email, email.trim().toLowerCase()))
    .limit(1);
  return row ?? null;
}

export async function findUserByTokenHash(tokenHash: string) {
  const [row] = await getDb()
    .select({ ...sessionColumns, tokenId: apiTokens.id, lastUsedAt: apiTokens.lastUsedAt })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, tokenHash), isNull(apiTokens.revokedAt), eq(users.active, true)))
    .limit(1);
  return row ?? null;
}

export async function touchApiToken(tokenId: string): Promise<void> {
  await getDb().update(apiTokens).set({ lastUsedAt: nowIso() }).where(eq(apiTokens.id, tokenId));
}

export async function recordSignIn(userId: string): Promise<void> {
  await getDb().update(users).set({ lastSignInAt: nowIso() }).where(eq(users.id, userId));
}

export async function recordSignInFailure(ip: string, email: string): Promise<void> {
  await getDb().insert(signInFailures).values({ ip, email: email.slice(0, 200), at: nowIso() });
}

export async function recentSignInFailures(ip: string, sinceIso: string) {
  const [row] = await getDb()
    .select({ n: count(), oldest: min(signInFailures.at) })
    .from(signInFailures)
    .where(and(eq(signInFailures.ip, ip), gte(signInFailures.at, sinceIso)));
  return { failures: row?.n ?? 0, oldestAt: row?.oldest ?? null };
}
