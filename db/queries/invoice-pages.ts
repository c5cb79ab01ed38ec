import { and, asc, desc, eq, exists, inArray, isNull, ne, notExists, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accounts, estimateLines, invoices, shopSettings, units, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel, type LineState } from "@/lib/domain";
import { APPROVED_STATES } from "@/lib/estimate";
import { buildInvoice } from "@/lib/invoices/build";
import { toAccountSettings, toShopSettings } from "./estimate-context";
import { toBillable } from "./invoice-issue";
import { invoicesOfWorkOrder } from "./invoices";
import { scopedTo } from "./scope";

const liveInvoice = (woId: typeof workOrders.id) =>
  getDb()
    .select({ one: sql`1` })
    .from(invoices)
    .where(and(eq(invoices.workOrderId, woId), ne(invoices.status, "void")));

/** Visits not yet settled for billing (work_orders_to_bill_number_idx; a literal, so the planner can use the partial index). */
const openForBilling = sql`${workOrders.nothingToBill} = 0`;

/** The work order has at least one line in one of these states. */
const hasLineIn = (states: readonly LineState[]) =>
  exists(
    getDb()
      .select({ one: sql`1` })
      .from(estimateLines)
      .where(and(eq(estimateLines.workOrderId, workOrders.id), inArray(estimateLines.state, states))),
  );

/** What the work order's Invoice section shows: a priced preview of the done lines, or the invoices issued. */
export async function invoiceSection(user: SessionUser, workOrderId: string) {
  const db = getDb();
  const [row] = await db
    .select({ wo: workOrders, account: accounts })
    .from(workOrders)
    .innerJoin(accounts, eq(accounts.id, workOrders.accountId))
    .where(and(eq(workOrders.id, workOrderId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  if (!row) return null;
  const [lines, [shop], issued] = await Promise.all([
    db.select().from(estimateLines).where(eq(estimateLines.workOrderId, workOrderId)).orderBy(asc(estimateLines.position), asc(estimateLines.createdAt)),
    db.select().from(shopSettings).where(eq(shopSettings.id, 1)).limit(1),
    invoicesOfWorkOrder(user, workOrderId),
  ]);
  if (!shop) throw new Error("shop settings missing");
  const draft = buildInvoice(lines.map(toBillable), toShopSettings(shop), toAccountSettings(row.account));
  const byId = new Map(lines.map((l) => [l.id, l]));
  return {
    workOrderId,
    poNumber: row.wo.poNumber,
    account: {
      name: row.account.name,
      poRequired: row.account.poRequired,
      taxExempt: row.account.taxExempt,
      taxExemptCertificate: row.account.taxExemptCertificate,
      paymentTermsDays: row.account.paymentTermsDays,
    },
    draft,
    notDone: draft.notDone.map((l) => ({ id: l.id, description: byId.get(l.id)?.description ?? l.description, state: l.state, kind: l.kind })),
    live: issued.find((i) => i.status !== "void") ?? null,
    voided: issued.filter((i) => i.status === "void"),
  };
}

/** Work orders with finished work and no live invoice: the shop's "ready to invoice" list. */
export async function readyToInvoice(user: SessionUser) {
  const rows = await getDb()
    .select({
      id: workOrders.id,
      number: workOrders.number,
      status: workOrders.status,
      title: workOrders.title,
      poNumber: workOrders.poNumber,
      accountName: accounts.name,
      poRequired: accounts.poRequired,
      unitNumber: units.unitNumber,
    })
    .from(workOrders)
    .innerJoin(accounts, eq(accounts.id, workOrders.accountId))
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(
      and(
        scopedTo(workOrders.accountId, user),
        openForBilling,
        // Visits still being worked on are invoiced when they reach final check. The unary + keeps
        // the planner off the status index, which holds every released visit ever: the few visits
        // open for billing come from the partial index instead.
        sql`+${workOrders.status} in ('final_check', 'ready', 'released')`,
        hasLineIn(["done"]),
        notExists(liveInvoice(workOrders.id)),
      ),
    )
    .orderBy(desc(workOrders.number));
  return rows.map((r) => ({ ...r, label: workOrderLabel(r.number), needsPo: r.poRequired && !r.poNumber }));
}

/** The fleet's work orders that cannot be invoiced until someone enters the PO number. */
export async function waitingForPo(user: SessionUser) {
  const rows = await getDb()
    .select({
      id: workOrders.id,
      number: workOrders.number,
      title: workOrders.title,
      status: workOrders.status,
      unitNumber: units.unitNumber,
    })
    .from(workOrders)
    .innerJoin(accounts, eq(accounts.id, workOrders.accountId))
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(
      and(
        scopedTo(workOrders.accountId, user),
        openForBilling,
        eq(accounts.poRequired, true),
        or(isNull(workOrders.poNumber), eq(workOrders.poNumber, "")),
        notExists(liveInvoice(workOrders.id)),
        hasLineIn(APPROVED_STATES),
      ),
    )
    .orderBy(desc(workOrders.number));
  return rows.map((r) => ({ ...r, label: workOrderLabel(r.number) }));
}
