import { and, count, eq, gte, min } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { signInFailures, users } from "@/db/schema";
import type { FailureCount } from "@/lib/auth/throttle-policy";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";

async function countWhere(where: ReturnType<typeof and>, now: number): Promise<FailureCount> {
  const [row] = await getDb().select({ n: count(), oldest: min(signInFailures.at) }).from(signInFailures).where(where);
  return { failures: row?.n ?? 0, msSinceOldest: row?.oldest ? now - Date.parse(row.oldest) : 0 };
}

/** Failed sign-ins inside the window, for the e-mail typed and for the client address. */
export async function recentSignInFailures(email: string, address: string, sinceIso: string, now = Date.now()) {
  const [account, fromAddress] = await Promise.all([
    countWhere(and(eq(signInFailures.email, email), gte(signInFailures.at, sinceIso)), now),
    countWhere(and(eq(signInFailures.ip, address), gte(signInFailures.at, sinceIso)), now),
  ]);
  return { account, address: fromAddress };
}

export async function recordSignInFailure(address: string, email: string): Promise<void> {
  await writeTx((tx) => tx.insert(signInFailures).values({ ip: address, email: email.slice(0, 200), at: nowIso() }));
}

export async function recordSignIn(userId: string): Promise<void> {
  await writeTx((tx) => tx.update(users).set({ lastSignInAt: nowIso() }).where(eq(users.id, userId)));
}

/** A sign-in that was slowed down or refused by the throttle, for the audit log. */
export async function recordThrottledSignIn(entry: { email: string; address: string; outcome: "delayed" | "locked_account" | "locked_address"; accountFailures: number; addressFailures: number; delayMs: number }): Promise<void> {
  await writeTx(async (tx) => {
    const [user] = await tx.select({ id: users.id, accountId: users.accountId }).from(users).where(eq(users.email, entry.email)).limit(1);
    await recordAudit(
      tx,
      { label: `sign-in from ${entry.address}` },
      { action: `sign_in.${entry.outcome}`, entityType: user ? "user" : "sign_in", entityId: user?.id ?? entry.email, accountId: user?.accountId ?? null, detail: entry },
    );
  });
}
