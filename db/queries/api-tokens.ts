import { and, desc, eq, isNull } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { apiTokens } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { generateApiToken } from "@/lib/auth/tokens";
import { notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";

export async function listMyTokens(user: SessionUser) {
  return getDb()
    .select({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt, revokedAt: apiTokens.revokedAt })
    .from(apiTokens)
    .where(eq(apiTokens.userId, user.id))
    .orderBy(desc(apiTokens.createdAt));
}

/** Creates a token for the signed-in user; the clear text is returned this once and never stored. */
export async function createToken(user: SessionUser, name: string) {
  const { token, hash, prefix } = generateApiToken();
  await writeTx(async (tx) => {
    const [row] = await tx.insert(apiTokens).values({ userId: user.id, name, tokenHash: hash, prefix }).returning({ id: apiTokens.id });
    await recordAudit(tx, user, { action: "token.created", entityType: "api_token", entityId: row!.id, accountId: user.accountId, detail: { name, prefix } });
  });
  return { token, prefix };
}

export async function revokeToken(user: SessionUser, tokenId: string) {
  await writeTx(async (tx) => {
    const [row] = await tx
      .update(apiTokens)
      .set({ revokedAt: nowIso() })
      .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, user.id), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id });
    if (!row) throw notFound("That token");
    await recordAudit(tx, user, { action: "token.revoked", entityType: "api_token", entityId: tokenId, accountId: user.accountId });
  });
}
