import { eq, sql, type SQL } from "drizzle-orm";
import type { SQLiteColumn } from "drizzle-orm/sqlite-core";
import { accountScope } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";

/** The account condition every read puts in its WHERE: all rows for staff, own account for fleet people. */
export function scopedTo(column: SQLiteColumn, user: Pick<SessionUser, "role" | "accountId">): SQL {
  const accountId = accountScope(user);
  return accountId === null ? sql`1 = 1` : eq(column, accountId);
}

/**
 * scopedTo for a prepared query (db/prepared.ts): the account is the `account` placeholder, filled
 * with `scopeOf(user)`; null (staff) matches every row. Only for reads that an id already narrows
 * to one row or a few, since the planner cannot pick an account index through the OR.
 */
export function scopedToPlaceholder(column: SQLiteColumn): SQL {
  return sql`(${sql.placeholder("account")} is null or ${column} = ${sql.placeholder("account")})`;
}

export function scopeOf(user: Pick<SessionUser, "role" | "accountId">): { account: string | null } {
  return { account: accountScope(user) };
}
