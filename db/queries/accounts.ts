import { and, asc, desc, eq, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accountContacts, accounts, auditLog, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invalidInput } from "@/lib/http/problem";
import { decodeCursor, paginate, type PageQuery } from "@/lib/http/pagination";
import { budgetUsedCents } from "./budget-use";
import { currentFiscalYear } from "./estimate-context";
import { scopedTo } from "./scope";

/** The fleet accounts the caller may see (every one for staff, their own for fleet people), with budget used this fiscal year. Archived ones only when asked. */
export async function listAccountsWithBudget(user: Pick<SessionUser, "role" | "accountId">, opts: { archived?: boolean } = {}) {
  const db = getDb();
  const rows = await db
    .select()
    .from(accounts)
    .where(and(scopedTo(accounts.id, user), opts.archived ? sql`${accounts.archivedAt} is not null` : isNull(accounts.archivedAt)))
    .orderBy(asc(accounts.name));
  return Promise.all(
    rows.map(async (a) => {
      const bounds = currentFiscalYear(a);
      return { ...a, budgetUsedCents: await budgetUsedCents(db, a.id, bounds), fiscalYear: bounds.fy.label };
    }),
  );
}

/** Names for pickers (check-in, invitations, units): accounts still in use. */
export async function accountChoices() {
  return getDb().select({ id: accounts.id, name: accounts.name }).from(accounts).where(isNull(accounts.archivedAt)).orderBy(asc(accounts.name));
}

/** The account's settings as the API shows them (cents, plain percents), with its budget this fiscal year. */
function apiView(a: typeof accounts.$inferSelect, usedCents: number, fiscalYear: string) {
  return {
    id: a.id,
    name: a.name,
    billingEmail: a.billingEmail,
    address: a.address,
    phone: a.phone,
    taxExempt: a.taxExempt,
    taxExemptCertificate: a.taxExemptCertificate,
    taxRatePct: a.taxRateMilliPct / 1000,
    poRequired: a.poRequired,
    termsDays: a.paymentTermsDays,
    fiscalYearStartMonth: a.fiscalYearStartMonth,
    fiscalYear,
    budgetCents: a.repairBudgetCents,
    budgetRemainingCents: a.repairBudgetCents === null ? null : Math.max(0, a.repairBudgetCents - usedCents),
    standingAuthorisationCents: a.standingAuthorisationCents,
    overrunPercent: a.overrunPercentMilli / 1000,
    overrunFloorCents: a.overrunFloorCents,
    overrunCapCents: a.overrunCapCents,
    shopSuppliesExempt: a.shopSuppliesExempt,
    archived: a.archivedAt !== null,
    archivedAt: a.archivedAt,
    updatedAt: a.updatedAt,
  };
}

/** GET /api/v1/accounts: the shop sees every account, a fleet person their own; paged by name. */
export async function listAccountsForApi(user: SessionUser, opts: PageQuery & { archived?: boolean }) {
  const after = decodeCursor(opts.cursor, 2);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
  const db = getDb();
  const rows = await db
    .select()
    .from(accounts)
    .where(
      and(
        scopedTo(accounts.id, user),
        opts.archived ? undefined : isNull(accounts.archivedAt),
        after ? sql`(${accounts.name}, ${accounts.id}) > (${String(after[0])}, ${String(after[1])})` : undefined,
      ),
    )
    .orderBy(asc(accounts.name), asc(accounts.id))
    .limit(opts.limit + 1);
  const { page, nextCursor } = paginate(rows, opts.limit, (r) => [r.name, r.id]);
  const out = await Promise.all(
    page.map(async (a) => {
      const bounds = currentFiscalYear(a);
      return apiView(a, await budgetUsedCents(db, a.id, bounds), bounds.fy.label);
    }),
  );
  return { accounts: out, nextCursor };
}

/** One account with its contacts, scoped: another account's id is null (404). */
export async function getAccountForApi(user: SessionUser, id: string) {
  const db = getDb();
  const [a] = await db.select().from(accounts).where(and(eq(accounts.id, id), scopedTo(accounts.id, user))).limit(1);
  if (!a) return null;
  const bounds = currentFiscalYear(a);
  const [used, contacts] = await Promise.all([budgetUsedCents(db, a.id, bounds), contactsOf(a.id)]);
  return { ...apiView(a, used, bounds.fy.label), contacts: contacts.map((c) => ({ id: c.id, name: c.name, role: c.title, email: c.email, phone: c.phone, billing: c.isBilling })) };
}

export async function contactsOf(accountId: string) {
  return getDb()
    .select({ id: accountContacts.id, name: accountContacts.name, title: accountContacts.title, email: accountContacts.email, phone: accountContacts.phone, isBilling: accountContacts.isBilling })
    .from(accountContacts)
    .where(eq(accountContacts.accountId, accountId))
    .orderBy(desc(accountContacts.isBilling), asc(accountContacts.createdAt));
}

/** Everything the shop's account page shows, or null when it does not exist or is outside the caller's scope. */
export async function accountSettingsPage(user: Pick<SessionUser, "role" | "accountId">, accountId: string) {
  const db = getDb();
  const [account] = await db.select().from(accounts).where(and(eq(accounts.id, accountId), scopedTo(accounts.id, user))).limit(1);
  if (!account) return null;
  const bounds = currentFiscalYear(account);
  const [people, changes, used, contacts] = await Promise.all([
    db
      .select({ id: users.id, name: users.name, email: users.email, role: users.role, signingLimitCents: users.signingLimitCents, active: users.active })
      .from(users)
      .where(eq(users.accountId, accountId))
      .orderBy(asc(users.role), asc(users.name)),
    db
      .select({ id: auditLog.id, at: auditLog.at, actor: auditLog.actorLabel, action: auditLog.action, detail: auditLog.detail })
      .from(auditLog)
      .where(and(eq(auditLog.accountId, accountId), eq(auditLog.entityType, "account")))
      .orderBy(desc(auditLog.at))
      .limit(30),
    budgetUsedCents(db, accountId, bounds),
    contactsOf(accountId),
  ]);
  return { account, people, changes, contacts, budgetUsedCents: used, fiscalYear: bounds.fy.label };
}

/** Whether any account exists yet (the empty first week shows a "start here" card). */
export async function hasAccounts(): Promise<boolean> {
  const [row] = await getDb().select({ id: accounts.id }).from(accounts).limit(1);
  return Boolean(row);
}
