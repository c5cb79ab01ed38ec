import { eq, sql, type SQL } from "drizzle-orm";
import type { SQLiteColumn } from "drizzle-orm/sqlite-core";
import { accountScope } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";

/** The account condition every read puts in its WHERE: all rows for staff, own account for fleet people. */
export function scopedTo(column: SQLiteColumn, user: Pick<SessionUser, "role" | "accountId">): SQL {
  const accountId = accountScope(user);
  return accountId === null ? sql`1 = 1` : eq(column, accountId);
}
