import { and, eq, gte, lt, type SQL } from "drizzle-orm";
import type { SQLiteColumn } from "drizzle-orm/sqlite-core";
import { getDb } from "@/db/client";
import { accounts, creditNotes, invoices, payments, units, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { accountScope } from "@/lib/auth/policy";
import { creditNoteLabel, invoiceLabel, workOrderLabel } from "@/lib/domain";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { balanceOf, paymentStateOf } from "@/lib/invoices/balance";
import { addDays } from "@/lib/dates";
import type { CsvCredit, CsvInvoice, CsvPayment } from "@/lib/invoices/csv";
import { addAgeing, ageBalances, emptyAgeing, type Ageing } from "@/lib/receivables/ageing";
import { openInvoices, paymentsOfAccount } from "./invoices";
import { scopedTo } from "./scope";

/** The account a user may read a statement of: their own, or any for the shop; null when not allowed (404). */
async function readableAccount(user: Pick<SessionUser, "role" | "accountId">, accountId: string) {
  const scope = accountScope(user);
  if (scope !== null && scope !== accountId) return null;
  const [row] = await getDb().select({ id: accounts.id, name: accounts.name }).from(accounts).where(eq(accounts.id, accountId)).limit(1);
  return row ?? null;
}

function paymentStatus(p: { applied: boolean; resolution: string | null }): CsvPayment["status"] {
  if (p.applied) return "applied";
  return p.resolution === "returned" ? "returned" : "held";
}

/**
 * Instants wide enough to hold calendar days from..to in any time zone (a day
 * either side in UTC); the exact days are then chosen in the shop's zone.
 */
function roughly(column: SQLiteColumn, from: string, to: string): SQL | undefined {
  return and(gte(column, `${addDays(from, -1)}T00:00:00.000Z`), lt(column, `${addDays(to, 2)}T00:00:00.000Z`));
}

/** Payments received on calendar days from..to (shop's time zone), both inclusive. */
async function paymentsBetween(accountId: string | null, from: string, to: string, timeZone: string) {
  // A day either side in UTC covers every time zone; the exact days are then chosen in the shop's.
  const rows = await paymentsOfAccount(accountId, `${addDays(from, -1)}T00:00:00.000Z`, `${addDays(to, 2)}T00:00:00.000Z`);
  return rows
    .map((p) => ({ ...p, receivedOn: calendarDate(new Date(p.receivedAt), timeZone) }))
    .filter((p) => p.receivedOn >= from && p.receivedOn <= to);
}

/**
 * The clerk's statement: open invoices aged on today's date in the shop's time
 * zone, the total due, and payments received in the period (default: the last 30 days).
 */
export async function accountStatement(
  user: Pick<SessionUser, "role" | "accountId">,
  accountId: string,
  period: { from?: string; to?: string },
  now = new Date(),
) {
  const account = await readableAccount(user, accountId);
  if (!account) return null;
  const timeZone = env().APP_TIME_ZONE;
  const asOf = calendarDate(now, timeZone);
  const to = period.to ?? asOf;
  const from = period.from ?? addDays(to, -29);
  const [open, paid] = await Promise.all([openInvoices(accountId), paymentsBetween(accountId, from, to, timeZone)]);
  const aged = ageBalances(
    open.map((i) => ({ ...i, dueOn: i.dueAt })),
    asOf,
  );
  const periodPayments = paid.map((p) => ({
    id: p.id,
    invoiceId: p.invoiceId,
    invoiceNumber: p.invoiceNumber,
    invoiceLabel: invoiceLabel(p.invoiceNumber),
    method: p.method,
    amountCents: p.amountCents,
    reference: p.reference,
    receivedAt: p.receivedAt,
    status: paymentStatus(p),
  }));
  return {
    accountId: account.id,
    accountName: account.name,
    asOf,
    timeZone,
    totalDueCents: aged.totalDueCents,
    ageing: aged.ageing,
    invoices: aged.items.map(({ dueOn: _dueOn, ...i }) => i),
    period: { from, to },
    payments: periodPayments,
    paymentsInPeriodCents: periodPayments.filter((p) => p.status === "applied").reduce((s, p) => s + p.amountCents, 0),
  };
}

export type Statement = NonNullable<Awaited<ReturnType<typeof accountStatement>>>;

/** The shop's receivables: every account's open balances in the same buckets, and card payments held for review. */
export async function receivables(user: Pick<SessionUser, "role" | "accountId">, now = new Date()) {
  const timeZone = env().APP_TIME_ZONE;
  const asOf = calendarDate(now, timeZone);
  const db = getDb();
  const [open, accountRows, held] = await Promise.all([
    openInvoices(accountScope(user)),
    db.select({ id: accounts.id, name: accounts.name }).from(accounts).where(scopedTo(accounts.id, user)).orderBy(accounts.name),
    db
      .select({
        id: payments.id,
        invoiceId: payments.invoiceId,
        invoiceNumber: invoices.number,
        accountName: accounts.name,
        amountCents: payments.amountCents,
        flagReason: payments.flagReason,
        receivedAt: payments.receivedAt,
      })
      .from(payments)
      .innerJoin(invoices, eq(invoices.id, payments.invoiceId))
      .innerJoin(accounts, eq(accounts.id, payments.accountId))
      .where(and(eq(payments.flagged, true), eq(payments.applied, false), scopedTo(payments.accountId, user)))
      .orderBy(payments.receivedAt),
  ]);
  let total: Ageing = emptyAgeing();
  const byAccount = accountRows.map((a) => {
    const aged = ageBalances(
      open.filter((i) => i.accountId === a.id).map((i) => ({ ...i, dueOn: i.dueAt })),
      asOf,
    );
    total = addAgeing(total, aged.ageing);
    return { accountId: a.id, accountName: a.name, ageing: aged.ageing, totalDueCents: aged.totalDueCents, invoiceCount: aged.items.length, oldestDays: aged.items[0]?.daysPastDue ?? null };
  });
  return {
    asOf,
    timeZone,
    accounts: byAccount,
    ageing: total,
    totalDueCents: byAccount.reduce((s, a) => s + a.totalDueCents, 0),
    heldPayments: held.filter((h) => h.flagReason !== null).map((h) => ({ ...h, invoiceLabel: invoiceLabel(h.invoiceNumber) })),
  };
}

/** Rows of the CSV export: invoices issued, payments received and credit notes issued from..to, both inclusive. */
export async function exportRows(user: Pick<SessionUser, "role" | "accountId">, accountId: string, from: string, to: string) {
  const account = await readableAccount(user, accountId);
  if (!account) return null;
  const timeZone = env().APP_TIME_ZONE;
  const rows = await getDb()
    .select({ invoice: invoices, workOrderNumber: workOrders.number, unitNumber: units.unitNumber })
    .from(invoices)
    .innerJoin(workOrders, eq(workOrders.id, invoices.workOrderId))
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(
      and(eq(invoices.accountId, accountId), roughly(invoices.issuedAt, from, to)),
    );
  const csvInvoices: CsvInvoice[] = rows
    .map(({ invoice: i, workOrderNumber, unitNumber }) => ({
      issuedOn: calendarDate(new Date(i.issuedAt), timeZone),
      invoice: invoiceLabel(i.number),
      workOrder: workOrderLabel(workOrderNumber),
      unit: unitNumber,
      poNumber: i.poNumber,
      state: paymentStateOf(i),
      dueOn: i.dueOn,
      laborCents: i.laborCents,
      partsCents: i.partsCents,
      subletCents: i.subletCents,
      feesCents: i.feesCents,
      shopSuppliesCents: i.shopSuppliesCents,
      taxCents: i.taxCents,
      coreCents: i.coreCents,
      totalCents: i.totalCents,
      balanceCents: balanceOf(i),
    }))
    .filter((i) => i.issuedOn >= from && i.issuedOn <= to);
  const csvPayments: CsvPayment[] = (await paymentsBetween(accountId, from, to, timeZone)).map((p) => ({
    receivedOn: p.receivedOn,
    invoice: invoiceLabel(p.invoiceNumber),
    workOrder: workOrderLabel(p.workOrderNumber),
    unit: p.unitNumber,
    poNumber: p.poNumber,
    status: paymentStatus(p),
    method: p.method,
    reference: p.reference,
    amountCents: p.amountCents,
  }));
  const creditRows = await getDb()
    .select({ credit: creditNotes, invoiceNumber: invoices.number, poNumber: invoices.poNumber, workOrderNumber: workOrders.number, unitNumber: units.unitNumber })
    .from(creditNotes)
    .innerJoin(invoices, eq(invoices.id, creditNotes.invoiceId))
    .innerJoin(workOrders, eq(workOrders.id, invoices.workOrderId))
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(
      and(eq(creditNotes.accountId, accountId), roughly(creditNotes.issuedAt, from, to)),
    );
  const csvCredits: CsvCredit[] = creditRows
    .map(({ credit: c, invoiceNumber, poNumber, workOrderNumber, unitNumber }) => ({
      issuedOn: calendarDate(new Date(c.issuedAt), timeZone),
      creditNote: creditNoteLabel(c.number),
      invoice: invoiceLabel(invoiceNumber),
      workOrder: workOrderLabel(workOrderNumber),
      unit: unitNumber,
      poNumber,
      reason: c.reason,
      amountCents: c.amountCents,
    }))
    .filter((c) => c.issuedOn >= from && c.issuedOn <= to);
  return { accountName: account.name, invoices: csvInvoices, payments: csvPayments, credits: csvCredits };
}
