import { and, asc, eq, isNull } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { accounts, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { isShopRole } from "@/lib/domain";
import { conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import type { PersonEditInput } from "@/lib/validation/people";
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

/**
 * The owner changes a person's name, role or signing limit. A role stays on
 * its side (shop staff have no account, fleet people one); the owner cannot
 * change their own role, so the shop is never left without one.
 */
export async function updatePerson(user: SessionUser, input: PersonEditInput) {
  return writeTx(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, input.userId)).limit(1);
    if (!before) throw notFound("That person");
    if (isShopRole(before.role) !== isShopRole(input.role)) {
      throw invalidInput([{ path: "role", message: isShopRole(before.role) ? "Shop staff keep a shop role." : "Fleet people keep a fleet role; invite them to the shop instead." }]);
    }
    if (before.id === user.id && input.role !== before.role) throw invalidInput([{ path: "role", message: "You cannot change your own role." }]);
    const signingLimitCents = input.role === "approver" ? (input.signingLimit ?? before.signingLimitCents ?? 0) : null;
    const next = { name: input.name, role: input.role, signingLimitCents };
    const changed = Object.fromEntries(
      (Object.keys(next) as (keyof typeof next)[]).filter((k) => before[k] !== next[k]).map((k) => [k, { from: before[k], to: next[k] }]),
    );
    if (Object.keys(changed).length === 0) return { changed: 0 };
    await tx.update(users).set({ ...next, updatedAt: nowIso() }).where(eq(users.id, before.id));
    await recordAudit(tx, user, {
      action: "person.edited",
      entityType: before.accountId ? "account" : "user",
      entityId: before.accountId ?? before.id,
      accountId: before.accountId,
      detail: { person: before.name, ...changed },
    });
    return { changed: Object.keys(changed).length };
  });
}

/** Turns sign-in on or off; sessions of a deactivated person stop working at their next request. */
export async function setPersonActive(user: SessionUser, userId: string, active: boolean) {
  if (userId === user.id && !active) throw conflict("cannot_deactivate_self", "You cannot turn off your own sign-in.");
  await writeTx(async (tx) => {
    const [row] = await tx.update(users).set({ active, updatedAt: nowIso() }).where(eq(users.id, userId)).returning({ accountId: users.accountId, name: users.name });
    if (!row) throw notFound("That person");
    await recordAudit(tx, user, {
      action: active ? "person.activated" : "person.deactivated",
      entityType: row.accountId ? "account" : "user",
      entityId: row.accountId ?? userId,
      accountId: row.accountId,
      detail: { person: row.name, active: { from: !active, to: active } },
    });
  });
}

/** Shop staff who can be given a visit (technicians first), for the technician pickers. */
export async function assignableStaff() {
  const rows = await getDb()
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(isNull(users.accountId), eq(users.active, true)))
    .orderBy(asc(users.name));
  return [...rows.filter((r) => r.role === "tech"), ...rows.filter((r) => r.role !== "tech")];
}
