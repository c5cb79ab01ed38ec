import { and, eq, gte, inArray, lt, lte, gt, sql } from "drizzle-orm";
import type { Db, Reader, Tx } from "@/db/client";
import { accountBudgetUse, accounts, estimateLines, workOrders } from "@/db/schema";
import { APPROVED_STATES, isApprovedState, type LineState } from "@/lib/estimate";
import { prepared } from "@/db/prepared";
import { currentFiscalYear } from "./estimate-context";

/*
 * The repair budget's running total: what each account approved in a fiscal year, one row per
 * account and fiscal year (keyed by its exact UTC bounds). Invariant, after every commit: each
 * row equals recountBudgetUsed for its account and bounds. It holds because a row starts from
 * that recount (inside the write transaction that first needs it) and every change to a line's
 * approved state, amount or instant moves every row whose bounds hold the old or new instant.
 *
 * Where those change (read from every write to estimate_lines): an approver's decisions and the
 * standing authorisation (line-changes.ts, proposed or draft → approved), and a revision that
 * sends an approved line back for approval (estimate-lines.ts editLine). Nothing else moves them:
 * declining and holding act on proposed lines only, removal on draft and proposed lines, release
 * holds or declines proposed lines, progress and "done" stay within the approved states with the
 * same amount and instant, a returned core leaves the approved amount as it was, and a work order
 * never changes account.
 */

export interface FiscalBounds {
  fromIso: string;
  toIso: string;
}

/** What a line adds to the budget of the fiscal year holding `approvedAt`: approved amounts only, a credit as zero. */
export interface BudgetShare {
  state: LineState;
  approvedAt: string | null;
  approvedAmountCents: number | null;
}

function shareOf(line: BudgetShare): { at: string; cents: number } | null {
  if (!isApprovedState(line.state) || !line.approvedAt || line.approvedAmountCents === null) return null;
  return { at: line.approvedAt, cents: Math.max(line.approvedAmountCents, 0) };
}

/** The full walk over every approved line of the account in the bounds: the truth the running total is checked against. */
export async function recountBudgetUsed(db: Reader, accountId: string, bounds: FiscalBounds): Promise<number> {
  const [row] = await db
    .select({ total: sql<number>`coalesce(sum(max(${estimateLines.approvedAmountCents}, 0)), 0)` })
    .from(estimateLines)
    .innerJoin(workOrders, eq(workOrders.id, estimateLines.workOrderId))
    .where(
      and(
        eq(workOrders.accountId, accountId),
        inArray(estimateLines.state, [...APPROVED_STATES]),
        gte(estimateLines.approvedAt, bounds.fromIso),
        lt(estimateLines.approvedAt, bounds.toIso),
      ),
    );
  return Number(row?.total ?? 0);
}

// Read by every work-order view and every decision, and moved by every approval: built once (db/prepared.ts).
const storedUseRow = prepared((db) =>
  db
    .select({ used: accountBudgetUse.usedCents })
    .from(accountBudgetUse)
    .where(and(eq(accountBudgetUse.accountId, sql.placeholder("account")), eq(accountBudgetUse.fromAt, sql.placeholder("from")), eq(accountBudgetUse.toAt, sql.placeholder("to"))))
    .limit(1)
    .prepare(),
);

const moveUse = prepared((db) =>
  db
    .update(accountBudgetUse)
    .set({ usedCents: sql`${accountBudgetUse.usedCents} + ${sql.placeholder("cents")}` })
    .where(and(eq(accountBudgetUse.accountId, sql.placeholder("account")), lte(accountBudgetUse.fromAt, sql.placeholder("at")), gt(accountBudgetUse.toAt, sql.placeholder("at"))))
    .prepare(),
);

async function storedUse(db: Reader, accountId: string, bounds: FiscalBounds): Promise<number | null> {
  const row = await storedUseRow(db).get({ account: accountId, from: bounds.fromIso, to: bounds.toIso });
  return row ? row.used : null;
}

/** What the account has approved in the fiscal year, for a page or a read: the running total, or a recount until a write has made it. */
export async function budgetUsedCents(db: Reader, accountId: string, bounds: FiscalBounds): Promise<number> {
  return (await storedUse(db, accountId, bounds)) ?? recountBudgetUsed(db, accountId, bounds);
}

/** The same inside a write transaction: the first time a fiscal year is asked for, its row is made from the recount. */
export async function budgetUsedForWrite(tx: Tx, accountId: string, bounds: FiscalBounds & { label: string }): Promise<number> {
  const stored = await storedUse(tx, accountId, bounds);
  if (stored !== null) return stored;
  const used = await recountBudgetUsed(tx, accountId, bounds);
  await tx.insert(accountBudgetUse).values({ accountId, fromAt: bounds.fromIso, toAt: bounds.toIso, fiscalYear: bounds.label, usedCents: used });
  return used;
}

/**
 * Moves the running totals for lines that changed, in the caller's transaction: each line as it
 * was and as it is now. Every row whose bounds hold an instant moves, whichever start month or
 * zone made it; a fiscal year with no row yet is counted when its row is made.
 */
export async function moveBudgetUse(tx: Tx, accountId: string, changed: readonly { before: BudgetShare; after: BudgetShare }[]): Promise<void> {
  const delta = new Map<string, number>();
  for (const { before, after } of changed) {
    const was = shareOf(before);
    const now = shareOf(after);
    if (was) delta.set(was.at, (delta.get(was.at) ?? 0) - was.cents);
    if (now) delta.set(now.at, (delta.get(now.at) ?? 0) + now.cents);
  }
  for (const [at, cents] of delta) {
    if (cents === 0) continue;
    await moveUse(tx).run({ account: accountId, at, cents });
  }
}

/**
 * Every account's current fiscal year made again from the recount, and every other row dropped
 * (they are made again from a recount when asked for): for the demo seed, the big-database
 * generator and the repair script (db/repair-budget-use.ts), never on a request's path.
 */
export async function rebuildBudgetUse(db: Tx | Db, now = new Date()): Promise<number> {
  await db.delete(accountBudgetUse);
  const all = await db.select({ id: accounts.id, fiscalYearStartMonth: accounts.fiscalYearStartMonth }).from(accounts);
  for (const a of all) {
    const bounds = currentFiscalYear(a, now);
    const used = await recountBudgetUsed(db, a.id, bounds);
    await db.insert(accountBudgetUse).values({ accountId: a.id, fromAt: bounds.fromIso, toAt: bounds.toIso, fiscalYear: bounds.fy.label, usedCents: used });
  }
  return all.length;
}
