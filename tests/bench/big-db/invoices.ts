import { invoiceLines, invoices, payments } from "@/db/schema";
import { addDays } from "@/lib/dates";
import type { PaymentMethod } from "@/lib/domain";
import type { AccountSettings, ShopSettings } from "@/lib/estimate";
import { bulkId } from "./ids";
import { buildInvoice, type BillableLine } from "@/lib/invoices/build";
import type { ShopSnapshot } from "@/lib/invoices/snapshot";
import type { BulkWriter } from "./bulk";
import type { GenLine } from "./lines";
import type { Visit } from "./plan";
import type { Rng } from "./rng";
import { DAY_MS, HOUR_MS } from "./world";

type InvoiceRow = typeof invoices.$inferInsert;

/**
 * Invoices for released visits, priced by the app's own invoice builder
 * (lib/invoices/build). Lines and payments are written as visits come;
 * headers are kept and numbered at the end in issue order, so numbers read
 * in date order with no gaps, as the counter would have made them.
 */
export class InvoiceWriter {
  private readonly headers: InvoiceRow[] = [];
  private readonly dateOf: Intl.DateTimeFormat;
  private readonly shopSnapshot: ShopSnapshot;

  constructor(
    private readonly w: BulkWriter,
    private readonly rng: Rng,
    private readonly now: number,
    private readonly shop: ShopSettings & { name: string; addressLines: string[]; phone: string; email: string; footer: string },
    private readonly people: { writer: string },
    timeZone: string,
    /** How many visits should have a first invoice voided and re-issued. */
    private voidsLeft: number,
    private visitsLeft: number,
  ) {
    this.dateOf = new Intl.DateTimeFormat("en-CA", { year: "numeric", month: "2-digit", day: "2-digit", timeZone });
    this.shopSnapshot = { name: shop.name, addressLines: shop.addressLines, phone: shop.phone, email: shop.email, footer: shop.footer };
  }

  get count(): number {
    return this.headers.length;
  }

  async add(v: Visit, lines: GenLine[], releasedAt: number, poNumber: string | null): Promise<void> {
    const a = v.account;
    const account: AccountSettings = {
      taxExempt: a.taxExempt, taxRateMilliPct: a.taxRateMilliPct, shopSuppliesExempt: a.shopSuppliesExempt,
      standingAuthorisationCents: a.standingAuthorisationCents, repairBudgetCents: null, fiscalYearStartMonth: a.fiscalYearStartMonth,
      overrunPercentMilli: a.overrunPercentMilli, overrunCapCents: a.overrunCapCents, overrunFloorCents: a.overrunFloorCents,
    };
    const billable: BillableLine[] = lines.map((l, position) => ({
      id: l.id, position, kind: l.template.kind, description: l.template.description, partNumber: l.template.partNumber ?? "",
      quantityMilli: l.quantityMilli, unitPriceCents: l.unitPriceCents, taxable: l.template.kind === "part",
      coreChargeCents: l.template.coreChargeCents ?? 0, coreReturned: l.coreReturnedAt !== null, state: l.state,
    }));
    const draft = buildInvoice(billable, this.shop, account);
    if (draft.lines.length === 0) throw new Error(`visit ${v.number} has nothing done to invoice`);

    const voided = this.rng.chance(this.voidsLeft / Math.max(1, this.visitsLeft));
    this.visitsLeft -= 1;
    // Issued a few hours to six days after release, and never in the future.
    const latest = Math.max(releasedAt + 10 * 60_000, this.now - HOUR_MS);
    let issuedAt = Math.min(releasedAt + this.rng.int(1, 6 * 24) * HOUR_MS, releasedAt + this.rng.next() * (latest - releasedAt));
    let replaces: string | null = null;
    if (voided) {
      this.voidsLeft -= 1;
      const first = bulkId();
      const reissuedAt = Math.min(issuedAt + this.rng.int(2, 12) * DAY_MS, issuedAt + (this.now - issuedAt) / 2);
      await this.header(first, v, draft, issuedAt, poNumber ? `${poNumber}-OLD` : null, {
        status: "void", voidedAt: new Date(reissuedAt - 2 * HOUR_MS).toISOString(), voidedBy: this.people.writer,
        voidReason: "Carried the wrong PO number; re-issued with the right one.",
      });
      replaces = first;
      issuedAt = reissuedAt;
    }
    await this.header(bulkId(), v, draft, issuedAt, poNumber, { replacesInvoiceId: replaces });
  }

  private async header(
    id: string,
    v: Visit,
    draft: ReturnType<typeof buildInvoice>,
    issuedAt: number,
    poNumber: string | null,
    extra: Partial<InvoiceRow>,
  ): Promise<void> {
    const a = v.account;
    const t = draft.totals;
    const issuedOn = this.dateOf.format(new Date(issuedAt));
    const live = extra.status !== "void";
    const paidCents = live ? await this.pay(id, v, t.totalCents, issuedAt) : 0;
    for (const l of draft.lines) {
      await this.w.add(invoiceLines, {
        id: bulkId(), invoiceId: id, sourceLineId: l.sourceLineId, position: l.position, kind: l.kind, description: l.description,
        partNumber: l.partNumber, quantityMilli: l.quantityMilli, unitPriceCents: l.unitPriceCents, amountCents: l.amountCents,
        taxable: l.taxable, coreChargeCents: l.coreChargeCents,
      });
    }
    const at = new Date(issuedAt).toISOString();
    this.headers.push({
      id, number: 0, workOrderId: v.id, accountId: a.id, status: paidCents >= t.totalCents ? "paid" : "open", poNumber,
      billTo: { accountName: a.name, address: a.address, email: a.billingEmail, phone: a.phone, contactName: a.contactName },
      shopSnapshot: this.shopSnapshot,
      unitSnapshot: {
        unitNumber: v.unit.unitNumber, description: v.unit.description, year: v.unit.year, vin: v.unit.vin, serialNumber: v.unit.serialNumber,
        workOrderNumber: v.number, workOrderTitle: "",
      },
      taxExemptCertificate: a.taxExempt ? (a.taxExemptCertificate ?? "") : null,
      taxRateMilliPct: a.taxExempt ? 0 : a.taxRateMilliPct, termsDays: a.paymentTermsDays, issuedAt: at,
      dueOn: addDays(issuedOn, a.paymentTermsDays),
      laborCents: t.laborCents, partsCents: t.partsCents, subletCents: t.subletCents, feesCents: t.feesCents,
      shopSuppliesCents: t.shopSuppliesCents, taxableCents: t.taxableCents, taxCents: t.taxCents, coreCents: t.coreCents,
      totalCents: t.totalCents, paidCents, creditedCents: 0, replacesInvoiceId: null, voidedAt: null, voidedBy: null, voidReason: null,
      issuedBy: this.people.writer, createdAt: at, updatedAt: at,
      ...extra,
    });
  }

  /** Older invoices are mostly paid; recent ones open or part paid. Returns what was paid. */
  private async pay(invoiceId: string, v: Visit, totalCents: number, issuedAt: number): Promise<number> {
    const age = (this.now - issuedAt) / DAY_MS;
    const r = this.rng.next();
    const full = age > 75 ? r < 0.96 : age > 30 ? r < 0.6 : r < 0.2;
    const part = !full && age > 20 && r < 0.8;
    if (!full && !part) return 0;
    const amount = full ? totalCents : Math.max(100, Math.round((totalCents * 0.4) / 100) * 100);
    const receivedAt = issuedAt + this.rng.int(5, Math.max(6, Math.min(60, Math.floor(age)))) * DAY_MS + this.rng.int(0, 86_399) * 1_000;
    if (receivedAt > this.now - HOUR_MS) return 0;
    const method: PaymentMethod = this.rng.pick(["cheque", "cheque", "transfer", "card"] as const);
    const paymentId = bulkId();
    await this.w.add(payments, {
      id: paymentId, invoiceId, accountId: v.account.id, method, amountCents: Math.min(amount, totalCents),
      reference: method === "cheque" ? String(this.rng.int(10_000, 99_999)) : method === "transfer" ? `ACH ${this.rng.int(1000, 9999)}` : "Online card payment",
      receivedAt: new Date(receivedAt).toISOString(), recordedBy: method === "card" ? v.account.clerkId : this.people.writer,
      checkoutSessionId: null, paymentIntentId: method === "card" ? `pi_big_${paymentId}` : null, flagged: false, flagReason: null,
      applied: true, resolution: null, resolvedAt: null, resolvedBy: null, note: "", createdAt: new Date(receivedAt).toISOString(),
    });
    return Math.min(amount, totalCents);
  }

  /** Numbers every invoice in issue order after `lastNumber`, writes them, and returns the last number. */
  async finish(lastNumber: number): Promise<number> {
    this.headers.sort((x, y) => x.issuedAt.localeCompare(y.issuedAt));
    let number = lastNumber;
    for (const h of this.headers) {
      h.number = ++number;
      await this.w.add(invoices, h);
    }
    return number;
  }
}
