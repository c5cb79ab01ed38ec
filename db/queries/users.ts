import { and, eq, isNull, sql } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { prepared } from "@/db/prepared";
import { apiTokens, users } from "@/db/schema";
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

// Every signed-in request reads its caller: built once (db/prepared.ts).
const activeUser = prepared((db) =>
  db
    .select({ ...sessionColumns, sessionVersion: users.sessionVersion })
    .from(users)
    .where(and(eq(users.id, sql.placeholder("id")), eq(users.active, true)))
    .limit(1)
    .prepare(),
);

const userByTokenHash = prepared((db) =>
  db
    .select({ ...sessionColumns, tokenId: apiTokens.id, lastUsedAt: apiTokens.lastUsedAt })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, sql.placeholder("hash")), isNull(apiTokens.revokedAt), eq(users.active, true)))
    .limit(1)
    .prepare(),
);

export async function findActiveUser(id: string): Promise<(Omit<SessionUser, "via"> & { sessionVersion: number }) | null> {
  return (await activeUser(getDb()).get({ id })) ?? null;
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
  return (await userByTokenHash(getDb()).get({ hash: tokenHash })) ?? null;
}

export async function touchApiToken(tokenId: string): Promise<void> {
  await writeTx((tx) => tx.update(apiTokens).set({ lastUsedAt: nowIso() }).where(eq(apiTokens.id, tokenId)));
}
