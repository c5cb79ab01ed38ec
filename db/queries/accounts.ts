import { and, asc, desc, eq } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { accounts, auditLog, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import type { AccountSettingsInput } from "@/lib/validation/account";
import { recordAudit } from "./audit";
import { budgetUsedCents, currentFiscalYear } from "./estimate-context";
import { scopedTo } from "./scope";

/** The fleet accounts the caller may see (every one for staff, their own for fleet people), with budget used this fiscal year. */
export async function listAccountsWithBudget(user: Pick<SessionUser, "role" | "accountId">) {
  const db = getDb();
  const rows = await db.select().from(accounts).where(scopedTo(accounts.id, user)).orderBy(asc(accounts.name));
  return Promise.all(
    rows.map(async (a) => {
      const bounds = currentFiscalYear(a);
      return { ...a, budgetUsedCents: await budgetUsedCents(db, a.id, bounds), fiscalYear: bounds.fy.label };
    }),
  );
}

/** One account's settings page, or null when it does not exist or is outside the caller's scope. */
export async function accountSettingsPage(user: Pick<SessionUser, "role" | "accountId">, accountId: string) {
  const db = getDb();
  const [account] = await db.select().from(accounts).where(and(eq(accounts.id, accountId), scopedTo(accounts.id, user))).limit(1);
  if (!account) return null;
  const bounds = currentFiscalYear(account);
  const [people, changes, used] = await Promise.all([
    db
      .select({ id: users.id, name: users.name, email: users.email, role: users.role, signingLimitCents: users.signingLimitCents, active: users.active })
      .from(users)
      .where(eq(users.accountId, accountId))
      .orderBy(asc(users.role), asc(users.name)),
    db
      .select({ at: auditLog.at, actor: auditLog.actorLabel, action: auditLog.action, detail: auditLog.detail })
      .from(auditLog)
      .where(and(eq(auditLog.accountId, accountId), eq(auditLog.entityType, "account")))
      .orderBy(desc(auditLog.at))
      .limit(30),
    budgetUsedCents(db, accountId, bounds),
  ]);
  return { account, people, changes, budgetUsedCents: used, fiscalYear: bounds.fy.label };
}

const FIELDS = [
  ["standingAuthorisationCents", "standingAuthorisation"],
  ["repairBudgetCents", "repairBudget"],
  ["fiscalYearStartMonth", "fiscalYearStartMonth"],
  ["overrunPercentMilli", "overrunPercent"],
  ["overrunCapCents", "overrunCap"],
  ["overrunFloorCents", "overrunFloor"],
  ["taxExempt", "taxExempt"],
  ["taxExemptCertificate", "taxExemptCertificate"],
  ["taxRateMilliPct", "taxRate"],
  ["poRequired", "poRequired"],
  ["paymentTermsDays", "paymentTermsDays"],
  ["shopSuppliesExempt", "shopSuppliesExempt"],
] as const;

/** Changes an account's limits and terms; the audit row lists each field's old and new value. */
export async function updateAccountSettings(user: SessionUser, input: AccountSettingsInput) {
  return writeTx(async (tx) => {
    const [before] = await tx.select().from(accounts).where(eq(accounts.id, input.accountId)).limit(1);
    if (!before) throw notFound("That account");
    const next = {
      standingAuthorisationCents: input.standingAuthorisation,
      repairBudgetCents: input.repairBudget,
      fiscalYearStartMonth: input.fiscalYearStartMonth,
      overrunPercentMilli: input.overrunPercent,
      overrunCapCents: input.overrunCap,
      overrunFloorCents: input.overrunFloor,
      taxExempt: input.taxExempt,
      taxExemptCertificate: input.taxExemptCertificate || null,
      taxRateMilliPct: input.taxRate,
      poRequired: input.poRequired,
      paymentTermsDays: input.paymentTermsDays,
      shopSuppliesExempt: input.shopSuppliesExempt,
    };
    const changed = Object.fromEntries(
      FIELDS.filter(([column]) => before[column] !== next[column]).map(([column]) => [column, { from: before[column], to: next[column] }]),
    );
    if (Object.keys(changed).length === 0) return { changed: 0 };
    await tx.update(accounts).set({ ...next, updatedAt: nowIso() }).where(eq(accounts.id, before.id));
    await recordAudit(tx, user, { action: "account.settings", entityType: "account", entityId: before.id, accountId: before.id, detail: changed });
    return { changed: Object.keys(changed).length };
  });
}

/** Sets an approver's signing limit; audited on the approver's account. */
export async function setSigningLimit(user: SessionUser, userId: string, cents: number) {
  return writeTx(async (tx) => {
    const [person] = await tx.select().from(users).where(and(eq(users.id, userId), eq(users.role, "approver"))).limit(1);
    if (!person || !person.accountId) throw notFound("That approver");
    if (person.signingLimitCents === cents) return;
    await tx.update(users).set({ signingLimitCents: cents, updatedAt: nowIso() }).where(eq(users.id, userId));
    await recordAudit(tx, user, {
      action: "account.signing_limit",
      entityType: "account",
      entityId: person.accountId,
      accountId: person.accountId,
      detail: { approver: person.name, signingLimitCents: { from: person.signingLimitCents, to: cents } },
    });
  });
}
