import { and, asc, desc, eq, gt, lt, lte, ne, or, sql, type SQL } from "drizzle-orm";
import { getDb, type Reader } from "@/db/client";
import { accounts, creditNotes, invoiceLines, invoices, payments, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { creditNoteLabel, invoiceLabel, type InvoiceStatus } from "@/lib/domain";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { invalidInput } from "@/lib/http/problem";
import { decodeCursor, paginate, type PageQuery } from "@/lib/http/pagination";
import { fromMilli } from "@/lib/money";
import { invoiceOut } from "@/lib/records/invoice";
import { scopedTo } from "./scope";

const listColumns = {
  id: invoices.id,
  number: invoices.number,
  accountId: invoices.accountId,
  workOrderId: invoices.workOrderId,
  status: invoices.status,
  issuedAt: invoices.issuedAt,
  dueOn: invoices.dueOn,
  totalCents: invoices.totalCents,
  paidCents: invoices.paidCents,
  creditedCents: invoices.creditedCents,
  poNumber: invoices.poNumber,
  accountName: accounts.name,
  workOrderNumber: workOrders.number,
  unitNumber: units.unitNumber,
};


function listItem(r: ListRow) {
  return { ...invoiceOut(r), unitNumber: r.unitNumber };
}

export type InvoiceListItem = ReturnType<typeof listItem>;
type ListRow = Awaited<ReturnType<typeof listQuery>>[number];

function listQuery(where: SQL | undefined) {
  return getDb()
    .select(listColumns)
    .from(invoices)
    .innerJoin(accounts, eq(accounts.id, invoices.accountId))
    .innerJoin(workOrders, eq(workOrders.id, invoices.workOrderId))
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(where);
}

/** Open invoices with a balance, nothing paid yet or part paid (paymentStateOf, in SQL so a page holds only those). */
function owingWith(state: "open" | "partly_paid"): SQL | undefined {
  return and(
    eq(invoices.status, "open"),
    gt(sql`${invoices.totalCents} - ${invoices.paidCents} - ${invoices.creditedCents}`, 0),
    state === "open" ? eq(invoices.paidCents, 0) : gt(invoices.paidCents, 0),
  );
}

/** Invoices the caller may see, newest number first (GET /api/v1/invoices, the invoice lists). */
export async function listInvoices(
  user: SessionUser,
  opts: PageQuery & { status?: InvoiceStatus; accountId?: string; workOrderId?: string; paymentState?: "open" | "partly_paid"; settled?: boolean },
): Promise<{ invoices: InvoiceListItem[]; nextCursor: string | null }> {
  const after = decodeCursor(opts.cursor, 1);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
  const rows = await listQuery(
    and(
      scopedTo(invoices.accountId, user),
      opts.status ? eq(invoices.status, opts.status) : undefined,
      opts.accountId ? eq(invoices.accountId, opts.accountId) : undefined,
      opts.workOrderId ? eq(invoices.workOrderId, opts.workOrderId) : undefined,
      opts.paymentState ? owingWith(opts.paymentState) : undefined,
      // Paid or void: nothing left to pay (the complement of openInvoices).
      opts.settled ? or(ne(invoices.status, "open"), lte(sql`${invoices.totalCents} - ${invoices.paidCents} - ${invoices.creditedCents}`, 0)) : undefined,
      after ? lt(invoices.number, Number(after[0])) : undefined,
    ),
  )
    .orderBy(desc(invoices.number))
    .limit(opts.limit + 1);
  const { page, nextCursor } = paginate(rows, opts.limit, (r) => [r.number]);
  return { invoices: page.map(listItem), nextCursor };
}

/** Every invoice of a work order, newest first (the shop's Invoice section). */
export async function invoicesOfWorkOrder(user: SessionUser, workOrderId: string): Promise<InvoiceListItem[]> {
  const rows = await listQuery(and(scopedTo(invoices.accountId, user), eq(invoices.workOrderId, workOrderId))).orderBy(
    desc(invoices.number),
  );
  return rows.map(listItem);
}

/** Open invoices with something left to pay, optionally for one account (statements, receivables). */
export async function openInvoices(accountId: string | null) {
  const rows = await listQuery(
    and(
      eq(invoices.status, "open"),
      gt(sql`${invoices.totalCents} - ${invoices.paidCents} - ${invoices.creditedCents}`, 0),
      accountId ? eq(invoices.accountId, accountId) : undefined,
    ),
  ).orderBy(asc(invoices.dueOn));
  return rows.map(listItem);
}

/** One invoice with lines and payments, scoped: null for another account's or a missing id. */
export async function getInvoiceDetail(user: Pick<SessionUser, "role" | "accountId">, id: string, db: Reader = getDb()) {
  const [inv] = await db
    .select({ invoice: invoices, accountName: accounts.name, workOrderNumber: workOrders.number, unitId: workOrders.unitId })
    .from(invoices)
    .innerJoin(accounts, eq(accounts.id, invoices.accountId))
    .innerJoin(workOrders, eq(workOrders.id, invoices.workOrderId))
    .where(and(eq(invoices.id, id), scopedTo(invoices.accountId, user)))
    .limit(1);
  if (!inv) return null;
  const i = inv.invoice;
  const [lineRows, paymentRows, related, creditRows] = await Promise.all([
    db.select().from(invoiceLines).where(eq(invoiceLines.invoiceId, i.id)).orderBy(asc(invoiceLines.position)),
    db
      .select({ payment: payments, recordedByName: users.name })
      .from(payments)
      .leftJoin(users, eq(users.id, payments.recordedBy))
      .where(eq(payments.invoiceId, i.id))
      .orderBy(asc(payments.receivedAt)),
    db
      .select({ id: invoices.id, number: invoices.number, replacesInvoiceId: invoices.replacesInvoiceId })
      .from(invoices)
      .where(or(eq(invoices.replacesInvoiceId, i.id), i.replacesInvoiceId ? eq(invoices.id, i.replacesInvoiceId) : undefined)),
    db.select().from(creditNotes).where(eq(creditNotes.invoiceId, i.id)).orderBy(asc(creditNotes.number)),
  ]);
  const replacedBy = related.find((r) => r.replacesInvoiceId === i.id) ?? null;
  const replaces = related.find((r) => r.id === i.replacesInvoiceId) ?? null;
  const tz = env().APP_TIME_ZONE;
  return {
    ...invoiceOut({ ...i, accountName: inv.accountName, workOrderNumber: inv.workOrderNumber }),
    unitId: inv.unitId,
    issuedOn: calendarDate(new Date(i.issuedAt), tz),
    termsDays: i.termsDays,
    billTo: i.billTo,
    shop: i.shopSnapshot,
    unit: i.unitSnapshot,
    taxExempt: i.taxExemptCertificate !== null,
    taxExemptCertificate: i.taxExemptCertificate,
    taxRatePercent: i.taxRateMilliPct / 1000,
    lines: lineRows.map((l) => ({
      id: l.id,
      kind: l.kind,
      description: l.description,
      partNumber: l.partNumber,
      quantity: fromMilli(l.quantityMilli),
      quantityMilli: l.quantityMilli,
      unitPriceCents: l.unitPriceCents,
      amountCents: l.amountCents,
      taxable: l.taxable,
      coreChargeCents: l.coreChargeCents,
    })),
    totals: {
      laborCents: i.laborCents,
      partsCents: i.partsCents,
      subletCents: i.subletCents,
      feesCents: i.feesCents,
      shopSuppliesCents: i.shopSuppliesCents,
      taxableCents: i.taxableCents,
      taxCents: i.taxCents,
      coreCents: i.coreCents,
      totalCents: i.totalCents,
    },
    payments: paymentRows.map(({ payment: p, recordedByName }) => ({
      id: p.id,
      method: p.method,
      amountCents: p.amountCents,
      reference: p.reference,
      receivedAt: p.receivedAt,
      receivedOn: calendarDate(new Date(p.receivedAt), tz),
      applied: p.applied,
      flagged: p.flagged,
      flagReason: p.flagReason,
      resolution: p.resolution,
      recordedBy: recordedByName,
    })),
    creditNotes: creditRows.map((c) => ({
      id: c.id,
      label: creditNoteLabel(c.number),
      amountCents: c.amountCents,
      reason: c.reason,
      issuedAt: c.issuedAt,
    })),
    voidedAt: i.voidedAt,
    voidReason: i.voidReason,
    replaces: replaces ? { id: replaces.id, number: replaces.number, label: invoiceLabel(replaces.number) } : null,
    replacedBy: replacedBy ? { id: replacedBy.id, number: replacedBy.number, label: invoiceLabel(replacedBy.number) } : null,
  };
}

export type InvoiceDetail = NonNullable<Awaited<ReturnType<typeof getInvoiceDetail>>>;

/** Payments of some invoices, for statements and exports. */
export async function paymentsOfAccount(accountId: string | null, fromIso: string, toIso: string) {
  return getDb()
    .select({
      id: payments.id,
      invoiceId: payments.invoiceId,
      invoiceNumber: invoices.number,
      workOrderNumber: workOrders.number,
      unitNumber: units.unitNumber,
      poNumber: invoices.poNumber,
      accountId: payments.accountId,
      method: payments.method,
      amountCents: payments.amountCents,
      reference: payments.reference,
      receivedAt: payments.receivedAt,
      applied: payments.applied,
      flagged: payments.flagged,
      resolution: payments.resolution,
    })
    .from(payments)
    .innerJoin(invoices, eq(invoices.id, payments.invoiceId))
    .innerJoin(workOrders, eq(workOrders.id, invoices.workOrderId))
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(
      and(
        accountId ? eq(payments.accountId, accountId) : undefined,
        sql`${payments.receivedAt} >= ${fromIso}`,
        lt(payments.receivedAt, toIso),
      ),
    )
    .orderBy(asc(payments.receivedAt));
}
