import { and, desc, eq, inArray, ne, sql } from "drizzle-orm";
import { writeTx, writeTxThen, type InSameTx, type Reader, type Tx } from "@/db/client";
import {
  accountContacts,
  accounts,
  concerns,
  counters,
  estimateLines,
  invoiceLines,
  invoices,
  shopSettings,
  units,
  workOrders,
  type Account,
  type EstimateLine,
  type Invoice,
  type ShopSettings as ShopRow,
  type Unit,
  type WorkOrder,
} from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invoiceLabel, workOrderLabel } from "@/lib/domain";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { dueDateOf } from "@/lib/invoices/balance";
import { buildInvoice, type BillableLine } from "@/lib/invoices/build";
import type { BillTo, ShopSnapshot, ThreeCs, UnitSnapshot } from "@/lib/invoices/snapshot";
import { recordAudit } from "./audit";
import { settleNothingToBill } from "./billing-state";
import { loadWorkOrderRow, toAccountSettings, toShopSettings } from "./estimate-context";

export function toBillable(row: EstimateLine): BillableLine {
  return {
    id: row.id,
    position: row.position,
    kind: row.kind,
    description: row.description,
    partNumber: row.partNumber,
    quantityMilli: row.quantityMilli,
    unitPriceCents: row.unitPriceCents,
    taxable: row.taxable,
    coreChargeCents: row.coreChargeCents,
    coreReturned: row.coreReturnedAt !== null,
    state: row.state,
  };
}


export interface InvoiceSources {
  wo: WorkOrder;
  account: Account;
  shop: ShopRow;
  unit: Unit;
  lines: EstimateLine[];
  billingContact: string;
  concerns: ThreeCs[];
}

/** The work order's invoice that is not void, if there is one (at most one: a unique index). */
export async function liveInvoiceOf(tx: Reader, workOrderId: string): Promise<Invoice | null> {
  const [live] = await tx
    .select()
    .from(invoices)
    .where(and(eq(invoices.workOrderId, workOrderId), ne(invoices.status, "void")))
    .limit(1);
  return live ?? null;
}

/** Everything an invoice is made from, read inside the caller's transaction. */
export async function loadInvoiceSources(tx: Tx, user: Pick<SessionUser, "role" | "accountId">, workOrderId: string): Promise<InvoiceSources> {
  const wo = await loadWorkOrderRow(tx, user, workOrderId);
  const [[account], [shop], [unit], lines, contacts, threeCs] = await Promise.all([
    tx.select().from(accounts).where(eq(accounts.id, wo.accountId)).limit(1),
    tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).limit(1),
    tx.select().from(units).where(eq(units.id, wo.unitId)).limit(1),
    tx.select().from(estimateLines).where(eq(estimateLines.workOrderId, wo.id)).orderBy(estimateLines.position, estimateLines.createdAt),
    tx.select({ name: accountContacts.name }).from(accountContacts).where(and(eq(accountContacts.accountId, wo.accountId), eq(accountContacts.isBilling, true))).limit(1),
    tx.select({ complaint: concerns.complaint, cause: concerns.cause, correction: concerns.correction }).from(concerns).where(eq(concerns.workOrderId, wo.id)).orderBy(concerns.position, concerns.createdAt),
  ]);
  if (!account || !shop || !unit) throw new Error("work order without account, unit or shop settings");
  return { wo, account, shop, unit, lines, billingContact: contacts[0]?.name ?? "", concerns: threeCs };
}

export function snapshots(src: InvoiceSources): { billTo: BillTo; shop: ShopSnapshot; unit: UnitSnapshot } {
  const { account, shop, unit, wo } = src;
  return {
    billTo: { accountName: account.name, address: account.address, email: account.billingEmail, phone: account.phone, contactName: src.billingContact },
    shop: {
      name: shop.shopName,
      addressLines: [shop.addressLine1, shop.addressLine2].filter(Boolean),
      phone: shop.phone,
      email: shop.email,
      footer: shop.invoiceFooter,
    },
    unit: {
      unitNumber: unit.unitNumber,
      description: unit.description,
      year: unit.year,
      vin: unit.vin,
      serialNumber: unit.serialNumber,
      workOrderNumber: wo.number,
      workOrderTitle: wo.title,
      concerns: src.concerns,
    },
  };
}

/**
 * Writes one invoice inside the caller's transaction: the next number from
 * the gap-free counter, a snapshot of who and what is billed, and the priced
 * lines. Shared by issuing and the demo seed so both follow the same rules.
 */
export async function createInvoiceInTx(
  tx: Tx,
  src: InvoiceSources,
  opts: { poNumber: string | null; issuedAt: Date; issuedBy: string | null; timeZone: string },
) {
  const { wo, account } = src;
  const live = await liveInvoiceOf(tx, wo.id);
  if (live) {
    throw conflict(
      "already_invoiced",
      `${workOrderLabel(wo.number)} is already on ${invoiceLabel(live.number)}. To correct it, void that invoice first.`,
    );
  }
  if (account.poRequired && !opts.poNumber) {
    throw conflict("po_required", `${account.name} requires a PO number on every invoice. Enter the PO number to issue it.`);
  }
  const draft = buildInvoice(src.lines.map(toBillable), toShopSettings(src.shop), toAccountSettings(account));
  if (draft.lines.length === 0) {
    throw conflict("nothing_to_invoice", `${workOrderLabel(wo.number)} has no completed lines to invoice yet.`);
  }
  const [counter] = await tx
    .update(counters)
    .set({ value: sql`${counters.value} + 1` })
    .where(eq(counters.name, "invoice"))
    .returning({ value: counters.value });
  if (!counter) throw new Error("the invoice counter is missing");
  const [previous] = await tx
    .select({ id: invoices.id })
    .from(invoices)
    .where(and(eq(invoices.workOrderId, wo.id), eq(invoices.status, "void")))
    .orderBy(desc(invoices.number))
    .limit(1);
  const issuedOn = calendarDate(opts.issuedAt, opts.timeZone);
  const snap = snapshots(src);
  const t = draft.totals;
  const [row] = await tx
    .insert(invoices)
    .values({
      number: counter.value,
      workOrderId: wo.id,
      accountId: account.id,
      status: "open",
      poNumber: opts.poNumber,
      billTo: snap.billTo,
      shopSnapshot: snap.shop,
      unitSnapshot: snap.unit,
      taxExemptCertificate: account.taxExempt ? (account.taxExemptCertificate ?? "") : null,
      taxRateMilliPct: account.taxExempt ? 0 : account.taxRateMilliPct,
      termsDays: account.paymentTermsDays,
      issuedAt: opts.issuedAt.toISOString(),
      dueOn: dueDateOf(issuedOn, account.paymentTermsDays),
      laborCents: t.laborCents,
      partsCents: t.partsCents,
      subletCents: t.subletCents,
      feesCents: t.feesCents,
      shopSuppliesCents: t.shopSuppliesCents,
      taxableCents: t.taxableCents,
      taxCents: t.taxCents,
      coreCents: t.coreCents,
      totalCents: t.totalCents,
      replacesInvoiceId: previous?.id ?? null,
      issuedBy: opts.issuedBy,
      createdAt: opts.issuedAt.toISOString(),
      updatedAt: opts.issuedAt.toISOString(),
    })
    .returning({ id: invoices.id, number: invoices.number });
  if (!row) throw new Error("invoice insert returned nothing");
  await tx.insert(invoiceLines).values(draft.lines.map((l) => ({ invoiceId: row.id, ...l })));
  await settleNothingToBill(tx, wo.id);
  return { id: row.id, number: row.number, accountId: account.id, totalCents: t.totalCents };
}

/** Issues the invoice for a work order (owner, writer). A PO number typed here is kept on the work order too. */
export async function issueInvoice(user: SessionUser, workOrderId: string, input: { poNumber?: string }, now = new Date(), notify?: InSameTx<{ id: string }>) {
  return writeTxThen(async (tx) => {
    const src = await loadInvoiceSources(tx, user, workOrderId);
    const typed = input.poNumber?.trim() || null;
    const poNumber = typed ?? src.wo.poNumber;
    if (typed && typed !== src.wo.poNumber) {
      await tx.update(workOrders).set({ poNumber: typed, updatedAt: nowIso() }).where(eq(workOrders.id, src.wo.id));
    }
    const created = await createInvoiceInTx(tx, src, { poNumber, issuedAt: now, issuedBy: user.id, timeZone: env().APP_TIME_ZONE });
    await recordAudit(tx, user, {
      action: "invoice.issue",
      entityType: "invoice",
      entityId: created.id,
      accountId: created.accountId,
      detail: { number: created.number, workOrderId, totalCents: created.totalCents, poNumber },
    });
    return created;
  }, notify);
}

/** Marks approved work finished (owner, writer, from the issue screen). */
export async function markLinesDone(user: SessionUser, workOrderId: string, lineIds: string[]) {
  return writeTx(async (tx) => {
    const wo = await loadWorkOrderRow(tx, user, workOrderId);
    const changed = await tx
      .update(estimateLines)
      .set({ state: "done", updatedAt: nowIso() })
      .where(
        and(
          eq(estimateLines.workOrderId, wo.id),
          inArray(estimateLines.id, lineIds),
          inArray(estimateLines.state, ["approved", "in_progress"]),
        ),
      )
      .returning({ id: estimateLines.id });
    if (changed.length > 0) {
      await recordAudit(tx, user, {
        action: "line.done",
        entityType: "work_order",
        entityId: wo.id,
        accountId: wo.accountId,
        detail: { lineIds: changed.map((c) => c.id) },
      });
    }
    return { count: changed.length };
  });
}

/** The clerk (or the shop) enters the work order's PO number before it is invoiced. */
export async function setWorkOrderPoNumber(user: SessionUser, workOrderId: string, poNumber: string) {
  return writeTx(async (tx) => {
    const wo = await loadWorkOrderRow(tx, user, workOrderId);
    const live = await liveInvoiceOf(tx, wo.id);
    if (live) {
      throw conflict(
        "already_invoiced",
        `${workOrderLabel(wo.number)} is already on ${invoiceLabel(live.number)}; an issued invoice does not change. Ask the shop to void and re-issue it.`,
      );
    }
    await tx.update(workOrders).set({ poNumber, updatedAt: nowIso() }).where(eq(workOrders.id, wo.id));
    await recordAudit(tx, user, {
      action: "work_order.po_number",
      entityType: "work_order",
      entityId: wo.id,
      accountId: wo.accountId,
      detail: { from: wo.poNumber, to: poNumber },
    });
    return { workOrderId: wo.id, poNumber };
  });
}
