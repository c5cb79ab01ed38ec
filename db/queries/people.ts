import { asc, eq } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { accounts, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { SessionUser } from "@/lib/auth/session-user";
import { conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import type { NewPersonInput } from "@/lib/validation/people";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

/** The people who sign in: everyone for the shop, one account's people for a fleet user. */
export async function listPeople(user: Pick<SessionUser, "role" | "accountId">) {
  return getDb()
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, accountId: users.accountId, accountName: accounts.name, signingLimitCents: users.signingLimitCents, active: users.active, lastSignInAt: users.lastSignInAt })
    .from(users)
    .leftJoin(accounts, eq(accounts.id, users.accountId))
    .where(scopedTo(users.accountId, user))
    .orderBy(asc(accounts.name), asc(users.role), asc(users.name));
}

export async function addPerson(user: SessionUser, input: NewPersonInput) {
  const passwordHash = await hashPassword(input.password);
  return writeTx(async (tx) => {
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1);
    if (taken) throw invalidInput([{ path: "email", message: "Someone already signs in with that e-mail." }]);
    if (input.accountId) {
      const [account] = await tx.select({ id: accounts.id }).from(accounts).where(eq(accounts.id, input.accountId)).limit(1);
      if (!account) throw invalidInput([{ path: "accountId", message: "That account does not exist." }]);
    }
    const [row] = await tx
      .insert(users)
      .values({
        name: input.name,
        email: input.email,
        role: input.role,
        accountId: input.accountId ?? null,
        signingLimitCents: input.role === "approver" ? input.signingLimit : null,
        passwordHash,
      })
      .returning({ id: users.id });
    await recordAudit(tx, user, { action: "person.added", entityType: "user", entityId: row!.id, accountId: input.accountId ?? null, detail: { email: input.email, role: input.role } });
    return row!;
  });
}

/** Turns sign-in on or off; sessions of a deactivated person stop working at their next request. */
export async function setPersonActive(user: SessionUser, userId: string, active: boolean) {
  if (userId === user.id && !active) throw conflict("cannot_deactivate_self", "You cannot turn off your own sign-in.");
  await writeTx(async (tx) => {
    const [row] = await tx.update(users).set({ active, updatedAt: nowIso() }).where(eq(users.id, userId)).returning({ accountId: users.accountId });
    if (!row) throw notFound("That person");
    await recordAudit(tx, user, { action: active ? "person.activated" : "person.deactivated", entityType: "user", entityId: userId, accountId: row.accountId });
  });
}
