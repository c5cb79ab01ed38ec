import { eq } from "drizzle-orm";
import { createInvoiceInTx, loadInvoiceSources, type InvoiceSources } from "@/db/queries/invoice-issue";
import { estimateLines, invoices, payments, workOrders } from "@/db/schema";
import type { PaymentMethod } from "@/lib/domain";
import { env } from "@/lib/env";
import { afterPayment, judgeOnlinePayment } from "@/lib/invoices/balance";
import { type SeedContext, daysAgo, id } from "./context";
import { seedDoneLines } from "./done-lines";

type Account = "township" | "schools" | "quarry";

/** How a first, voided invoice was wrong; the replacement is right. */
type Mistake = "old_po" | "no_po" | "field_rate" | "tax_on_labour" | "cores_came_back";

interface PaymentPlan {
  daysAgo: number;
  method: PaymentMethod;
  /** Part of the total in thousandths (400 = 40 %), or "rest" for the balance. */
  share: number | "rest";
  reference: string;
  /** A card payment that did not match the balance, held for the shop. */
  mismatch?: true;
}

interface InvoicePlan {
  wo: string;
  account: Account;
  issuedDaysAgo: number;
  voided?: { issuedDaysAgo: number; mistake: Mistake; reason: string };
  payments?: PaymentPlan[];
}

const SYSTEM = { role: "owner", accountId: null } as const;

/*
 * Released visits invoiced so each account has open, partly paid, paid and
 * void invoices, with open balances in every ageing bucket on the day the demo
 * is loaded (net 30: issued ≤ 30 days ago is current; 31–60 is 1–30 past due …).
 * Some invoices went out late (the township's PO numbers, month-end batching);
 * some were voided and re-issued after the customer spotted a mistake.
 */
const PLANS: InvoicePlan[] = [
  // Brennan Township (PO required, tax exempt)
  { wo: "W-1001", account: "township", issuedDaysAgo: 27 },
  { wo: "W-1009", account: "township", issuedDaysAgo: 46, payments: [
    { daysAgo: 20, method: "cheque", share: 400, reference: "20417" },
    { daysAgo: 6, method: "card", share: 1000, reference: "Online card payment", mismatch: true },
  ] },
  { wo: "W-1003", account: "township", issuedDaysAgo: 86 },
  { wo: "W-1002", account: "township", issuedDaysAgo: 112, voided: { issuedDaysAgo: 134, mistake: "old_po", reason: "Carried last fiscal year's PO number; re-issued with the current one." }, payments: [
    { daysAgo: 70, method: "transfer", share: 500, reference: "ACH 7741" },
  ] },
  { wo: "W-1005", account: "township", issuedDaysAgo: 143 },
  { wo: "W-1011", account: "township", issuedDaysAgo: 55, payments: [{ daysAgo: 30, method: "transfer", share: "rest", reference: "ACH 7790" }] },
  { wo: "W-1012", account: "township", issuedDaysAgo: 152, payments: [{ daysAgo: 125, method: "card", share: "rest", reference: "Online card payment" }] },
  { wo: "W-1004", account: "township", issuedDaysAgo: 187, payments: [
    { daysAgo: 170, method: "cheque", share: 600, reference: "19886" },
    { daysAgo: 150, method: "cheque", share: "rest", reference: "19954" },
  ] },
  { wo: "W-1006", account: "township", issuedDaysAgo: 196, payments: [{ daysAgo: 168, method: "cheque", share: "rest", reference: "19870" }] },
  { wo: "W-1008", account: "township", issuedDaysAgo: 249, payments: [{ daysAgo: 222, method: "transfer", share: "rest", reference: "ACH 7102" }] },
  // Alder Falls schools (tax exempt, no PO required)
  { wo: "W-1015", account: "schools", issuedDaysAgo: 21, voided: { issuedDaysAgo: 161, mistake: "no_po", reason: "The business office asked for its purchase order number on the invoice." } },
  { wo: "W-1014", account: "schools", issuedDaysAgo: 50, voided: { issuedDaysAgo: 205, mistake: "field_rate", reason: "Labour billed at the field-service rate; the work was done in the shop." }, payments: [
    { daysAgo: 25, method: "cheque", share: 500, reference: "55120" },
  ] },
  { wo: "W-1019", account: "schools", issuedDaysAgo: 64 },
  { wo: "W-1028", account: "schools", issuedDaysAgo: 95, payments: [{ daysAgo: 62, method: "transfer", share: "rest", reference: "EFT 3204" }] },
  { wo: "W-1013", account: "schools", issuedDaysAgo: 108, payments: [{ daysAgo: 60, method: "transfer", share: 300, reference: "EFT 3318" }] },
  { wo: "W-1016", account: "schools", issuedDaysAgo: 214 },
  { wo: "W-1018", account: "schools", issuedDaysAgo: 267, payments: [{ daysAgo: 240, method: "transfer", share: "rest", reference: "EFT 2990" }] },
  { wo: "W-1017", account: "schools", issuedDaysAgo: 311, payments: [{ daysAgo: 290, method: "card", share: "rest", reference: "Online card payment" }] },
  { wo: "W-1020", account: "schools", issuedDaysAgo: 320, payments: [{ daysAgo: 300, method: "cheque", share: "rest", reference: "54007" }] },
  // Kettle Ridge Stone (taxable 6.25 %, net 30)
  { wo: "W-1022", account: "quarry", issuedDaysAgo: 12, voided: { issuedDaysAgo: 170, mistake: "tax_on_labour", reason: "Sales tax was charged on labour; only parts are taxed." } },
  { wo: "W-1021", account: "quarry", issuedDaysAgo: 55, payments: [{ daysAgo: 15, method: "cheque", share: 450, reference: "8812" }] },
  { wo: "W-1025", account: "quarry", issuedDaysAgo: 75, voided: { issuedDaysAgo: 179, mistake: "cores_came_back", reason: "Both chamber and slack-adjuster cores came back; re-issued without core charges." } },
  { wo: "W-1023", account: "quarry", issuedDaysAgo: 112, payments: [{ daysAgo: 80, method: "card", share: 250, reference: "Online card payment" }] },
  { wo: "W-1024", account: "quarry", issuedDaysAgo: 223 },
  { wo: "W-1026", account: "quarry", issuedDaysAgo: 232, payments: [{ daysAgo: 210, method: "card", share: "rest", reference: "Online card payment" }] },
  { wo: "W-1027", account: "quarry", issuedDaysAgo: 329, payments: [{ daysAgo: 301, method: "cheque", share: "rest", reference: "8120" }] },
];

function poFor(plan: InvoicePlan, issuedAt: string, n: number): string | null {
  if (plan.account === "township") return `BT-${issuedAt.slice(0, 4)}-${String(100 + n * 7).padStart(4, "0")}`;
  if (plan.account === "schools" && plan.voided?.mistake === "no_po") return `AFSD-PO-${issuedAt.slice(2, 4)}-${418 + n}`;
  return null;
}

/** The voided invoice's sources: the same work, priced with the mistake it had. */
function withMistake(src: InvoiceSources, mistake: Mistake): InvoiceSources {
  const lines = src.lines.map((l) => {
    if (mistake === "field_rate" && l.kind === "labor") return { ...l, unitPriceCents: 16_500 };
    if (mistake === "tax_on_labour" && l.kind === "labor") return { ...l, taxable: true };
    if (mistake === "cores_came_back") return { ...l, coreReturnedAt: null };
    return l;
  });
  return { ...src, lines };
}

type Event = { at: string; plan: InvoicePlan; n: number; kind: "voided" | "live" };

export async function seedInvoices(ctx: SeedContext): Promise<void> {
  const timeZone = env().APP_TIME_ZONE;
  const writer = id(ctx, "user:writer@quarry-road.example");
  const events: Event[] = [];
  for (const [n, plan] of PLANS.entries()) {
    await seedDoneLines(ctx, plan.wo, plan.account, (n % 4) * 300);
    events.push({ at: daysAgo(ctx, plan.issuedDaysAgo, 16), plan, n, kind: "live" });
    if (plan.voided) events.push({ at: daysAgo(ctx, plan.voided.issuedDaysAgo, 16), plan, n, kind: "voided" });
  }
  // Numbers follow issue dates, so the sequence reads in order with no gaps.
  events.sort((a, b) => a.at.localeCompare(b.at));
  const firstInvoice = new Map<string, string>();

  for (const e of events) {
    const woId = id(ctx, `wo:${e.plan.wo}`);
    let po = poFor(e.plan, e.at, e.n);
    if (e.kind === "voided" && e.plan.voided?.mistake === "no_po") po = null;
    if (e.kind === "voided" && e.plan.voided?.mistake === "old_po") po = `BT-${Number(e.at.slice(0, 4)) - 1}-0977`;
    await ctx.db.update(workOrders).set({ poNumber: po }).where(eq(workOrders.id, woId));
    if (e.kind === "live") {
      const first = firstInvoice.get(e.plan.wo);
      // The customer spotted the mistake just before the replacement went out.
      if (first && e.plan.voided) {
        const voidedAt = new Date(Date.parse(e.at) - 2 * 3_600_000).toISOString();
        await ctx.db.update(invoices).set({ status: "void", voidedAt, voidedBy: writer, voidReason: e.plan.voided.reason, updatedAt: voidedAt }).where(eq(invoices.id, first));
      }
      if (e.plan.voided?.mistake === "cores_came_back") {
        await ctx.db.update(estimateLines).set({ coreReturnedAt: e.at }).where(eq(estimateLines.workOrderId, woId));
      }
    }
    let src = await loadInvoiceSources(ctx.db, SYSTEM, woId);
    if (e.kind === "voided" && e.plan.voided) src = withMistake(src, e.plan.voided.mistake);
    const created = await createInvoiceInTx(ctx.db, src, { poNumber: po, issuedAt: new Date(e.at), issuedBy: writer, timeZone });
    if (e.kind === "voided") firstInvoice.set(e.plan.wo, created.id);
    else await seedPayments(ctx, created.id, e.plan.payments ?? []);
  }
}

async function seedPayments(ctx: SeedContext, invoiceId: string, plans: PaymentPlan[]): Promise<void> {
  const [inv] = await ctx.db.select().from(invoices).where(eq(invoices.id, invoiceId)).limit(1);
  if (!inv) throw new Error("seed: invoice vanished");
  const clerk = id(ctx, "user:clerk@brennan-twp.example");
  const writer = id(ctx, "user:writer@quarry-road.example");
  let money = { status: inv.status, totalCents: inv.totalCents, paidCents: inv.paidCents, creditedCents: inv.creditedCents };
  for (const [i, p] of plans.entries()) {
    const balance = money.totalCents - money.paidCents;
    // Part payments are round dollar amounts; a mismatched card payment is the whole total paid again.
    const amount = p.share === "rest" ? balance : p.mismatch ? inv.totalCents : Math.round((inv.totalCents * p.share) / 1000 / 100) * 100;
    const verdict = judgeOnlinePayment(money, amount);
    const card = p.method === "card";
    const intent = card ? `pi_demo_${invoiceId.slice(0, 10)}_${i}` : null;
    await ctx.db.insert(payments).values({
      invoiceId,
      accountId: inv.accountId,
      method: p.method,
      amountCents: amount,
      reference: p.reference,
      receivedAt: daysAgo(ctx, p.daysAgo, 17),
      recordedBy: card ? (inv.accountId === id(ctx, "account:township") ? clerk : null) : writer,
      paymentIntentId: intent,
      flagged: p.mismatch ?? false,
      flagReason: p.mismatch && !verdict.apply ? verdict.reason : null,
      applied: !p.mismatch,
    });
    if (!p.mismatch) money = afterPayment(money, amount);
  }
  await ctx.db.update(invoices).set({ paidCents: money.paidCents, status: money.status }).where(eq(invoices.id, invoiceId));
}
