import { and, eq, inArray, isNull } from "drizzle-orm";
import { getDb, type Reader } from "@/db/client";
import { users } from "@/db/schema";
import type { FleetRole, ShopRole } from "@/lib/domain";

/** E-mail addresses of an account's active people in the given roles. */
export async function accountRecipients(accountId: string, roles: readonly FleetRole[], db: Reader = getDb()): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(users)
    .where(and(eq(users.accountId, accountId), inArray(users.role, [...roles]), eq(users.active, true)));
  return rows.map((r) => r.email);
}

/** The shop's active staff in the given roles, with their ids. */
export async function shopPeople(roles: readonly ShopRole[], db: Reader = getDb()): Promise<{ id: string; email: string }[]> {
  return db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(and(isNull(users.accountId), inArray(users.role, [...roles]), eq(users.active, true)));
}

/** E-mail addresses of the shop's active staff in the given roles. */
export async function shopRecipients(roles: readonly ShopRole[], db: Reader = getDb()): Promise<string[]> {
  return (await shopPeople(roles, db)).map((r) => r.email);
}

export async function userEmail(userId: string | null, db: Reader = getDb()): Promise<string[]> {
  if (!userId) return [];
  const [row] = await db.select({ email: users.email, active: users.active }).from(users).where(eq(users.id, userId)).limit(1);
  return row?.active ? [row.email] : [];
}
