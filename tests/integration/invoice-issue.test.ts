import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as getInvoice } from "@/app/api/v1/invoices/[id]/route";
import { GET as invoicePdf } from "@/app/api/v1/invoices/[id]/pdf/route";
import { GET as listInvoices } from "@/app/api/v1/invoices/route";
import { getDb, writeTx } from "@/db/client";
import { issueInvoice, markLinesDone, setWorkOrderPoNumber } from "@/db/queries/invoice-issue";
import { voidInvoice } from "@/db/queries/payments";
import { accounts, concerns, counters, estimateLines, invoices, workOrders } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { HttpError } from "@/lib/http/problem";
import { queueInvoiceIssued } from "@/lib/server/notifications/invoices";
import { call } from "./helpers/app";
import { allInvoiceNumbers, asUser, setLines } from "./helpers/billing";
import { workOrderByNumber } from "./helpers/work-orders";
import { fileMailbox } from "./helpers/mail";

// Rules from the issue and product.md ("Invoices and payments", "Computation
// rules"); amounts worked by hand beside each check.
const smtp = fileMailbox();
beforeAll(async () => {
  resetEnvCache();
});
afterAll(async () => {
});

async function refusal(p: Promise<unknown>): Promise<HttpError> {
  const error = await p.then(() => null, (e: unknown) => e);
  if (!(error instanceof HttpError)) throw new Error(`expected a refusal, got ${String(error)}`);
  return error;
}

async function counterValue(): Promise<number> {
  const [c] = await getDb().select().from(counters).where(eq(counters.name, "invoice"));
  return c?.value ?? 0;
}

describe("issuing an invoice for a township work order (PO required, tax exempt)", () => {
  it("is refused without a PO number, and nothing is numbered; with the clerk's PO it is issued", async () => {
    const writer = await asUser("writer@quarry-road.example");
    const wo = await workOrderByNumber(1010);
    await getDb().update(workOrders).set({ poNumber: null }).where(eq(workOrders.id, wo.id));
    await setLines(wo.id, [
      // 2.0 h × $142.50 = $285.00
      { kind: "labor", description: "Replace wing cylinder seals", quantityMilli: 2000, unitPriceCents: 14_250 },
      // 1 × $96.50, taxable part, but the account is exempt
      { kind: "part", description: "Seal kit", quantityMilli: 1000, unitPriceCents: 9_650, taxable: true },
    ]);
    const before = await counterValue();
    const refused = await refusal(issueInvoice(writer, wo.id, {}));
    expect(refused.code).toBe("po_required");
    expect(refused.detail).toContain("Brennan Township Highway Department requires a PO number");
    expect(await counterValue()).toBe(before);
    expect(await getDb().select().from(invoices).where(eq(invoices.workOrderId, wo.id))).toHaveLength(0);

    // The township's clerk enters the PO on the work order; another account's clerk cannot see it.
    const quarry = await asUser("office@kettle-ridge.example");
    expect((await refusal(setWorkOrderPoNumber(quarry, wo.id, "X"))).status).toBe(404);
    await setWorkOrderPoNumber(await asUser("clerk@brennan-twp.example"), wo.id, "BT-2026-0500");

    const issued = await issueInvoice(writer, wo.id, {});
    expect(issued.number).toBe(before + 1);
    const res = await call<{ poNumber: string; taxExemptCertificate: string; totals: Record<string, number>; totalCents: number; balanceCents: number; status: string; dueAt: string; issuedOn: string }>(getInvoice, {
      path: `/api/v1/invoices/${issued.id}`,
      params: { id: issued.id },
      as: "clerk@brennan-twp.example",
    });
    expect(res.status).toBe(200);
    expect(res.body.poNumber).toBe("BT-2026-0500");
    expect(res.body.taxExemptCertificate).toBe("EX-BT-20417");
    // Supplies 8 % × $285.00 = $22.80; no tax; total 285.00 + 96.50 + 22.80 = $404.30.
    expect(res.body.totals).toMatchObject({ laborCents: 28_500, partsCents: 9_650, shopSuppliesCents: 2_280, taxCents: 0, totalCents: 40_430 });
    expect([res.body.status, res.body.balanceCents]).toEqual(["open", 40_430]);
    // Net 30: due 30 calendar days after the issue date.
    expect(Date.parse(`${res.body.dueAt}T00:00:00Z`) - Date.parse(`${res.body.issuedOn}T00:00:00Z`)).toBe(30 * 86_400_000);
  });

  it("a second live invoice for the same work order is refused", async () => {
    const wo = await workOrderByNumber(1010);
    const refused = await refusal(issueInvoice(await asUser("owner@quarry-road.example"), wo.id, {}));
    expect(refused.code).toBe("already_invoiced");
  });
});

describe("a taxable account (Kettle Ridge, 6.25 %)", () => {
  it("bills done lines only, taxes parts once on the subtotal, charges cores apart; marking approved lines done adds them", async () => {
    const writer = await asUser("writer@quarry-road.example");
    const wo = await workOrderByNumber(1048);
    const [, , approvedId] = await setLines(wo.id, [
      // 1.5 h × $142.50 = $213.75
      { kind: "labor", description: "Repair chafed ABS sensor lead", quantityMilli: 1500, unitPriceCents: 14_250 },
      // 2 × $41.25 = $82.50, taxable, core $10.00 each → $20.00 apart
      { kind: "part", description: "ABS sensor", quantityMilli: 2000, unitPriceCents: 4_125, taxable: true, coreChargeCents: 1_000 },
      { kind: "part", description: "Connector kit", quantityMilli: 1000, unitPriceCents: 1_999, taxable: true, state: "approved" },
      { kind: "part", description: "Declined extra", quantityMilli: 1000, unitPriceCents: 50_000, taxable: true, state: "declined" },
    ]);
    if (!approvedId) throw new Error("fixture");
    expect(await markLinesDone(writer, wo.id, [approvedId])).toEqual({ count: 1 });
    const issued = await issueInvoice(writer, wo.id, {});
    const [inv] = await getDb().select().from(invoices).where(eq(invoices.id, issued.id));
    // Parts 82.50 + 19.99 = 102.49; supplies 8 % × 213.75 = 17.10; tax 6.25 % × 102.49 = 6.405625 → 6.41;
    // cores 20.00; total 213.75 + 102.49 + 17.10 + 6.41 + 20.00 = 359.75
    expect(inv).toMatchObject({ laborCents: 21_375, partsCents: 10_249, shopSuppliesCents: 1_710, taxableCents: 10_249, taxCents: 641, coreCents: 2_000, totalCents: 35_975, taxExemptCertificate: null, taxRateMilliPct: 6_250 });
    // The visit's complaint, cause and correction travel on the invoice as they stood at issue.
    const [first] = await getDb().select().from(concerns).where(eq(concerns.workOrderId, wo.id)).orderBy(concerns.position);
    expect(inv!.unitSnapshot?.concerns?.[0]).toEqual({ complaint: first!.complaint, cause: first!.cause, correction: first!.correction });
  });
});

describe("an issued invoice never changes; corrections void it and issue a new one", () => {
  it("keeps its lines and bill-to when the work order or the account changes later", async () => {
    const wo = await workOrderByNumber(1048);
    const [inv] = await getDb().select().from(invoices).where(eq(invoices.workOrderId, wo.id));
    if (!inv) throw new Error("fixture");
    await getDb().update(estimateLines).set({ unitPriceCents: 99_999 }).where(eq(estimateLines.workOrderId, wo.id));
    await getDb().update(accounts).set({ address: "Moved away" }).where(eq(accounts.id, inv.accountId));
    const res = await call<{ totalCents: number; billTo: { address: string }; lines: { amountCents: number }[] }>(getInvoice, {
      path: `/api/v1/invoices/${inv.id}`,
      params: { id: inv.id },
      as: "owner@quarry-road.example",
    });
    expect(res.body.totalCents).toBe(35_975);
    expect(res.body.billTo.address).toContain("Kettle Ridge Pit Road");
    expect(res.body.lines.map((l) => l.amountCents)).toEqual([21_375, 8_250, 1_999]);
  });

  it("voiding keeps the numbering unbroken: the void keeps its number, the replacement takes the next", async () => {
    const writer = await asUser("writer@quarry-road.example");
    const wo = await workOrderByNumber(1007);
    await getDb().update(workOrders).set({ poNumber: "BT-2026-0600" }).where(eq(workOrders.id, wo.id));
    await setLines(wo.id, [{ kind: "labor", description: "Service", quantityMilli: 1000, unitPriceCents: 14_250 }]);
    const first = await issueInvoice(writer, wo.id, {});
    await voidInvoice(writer, first.id, "Wrong PO number on the invoice");
    const second = await issueInvoice(writer, wo.id, { poNumber: "BT-2026-0601" });
    expect(second.number).toBe(first.number + 1);

    const numbers = await allInvoiceNumbers();
    const [lowest] = numbers;
    expect(numbers).toEqual(numbers.map((_, i) => (lowest ?? 0) + i));
    expect(numbers.at(-1)).toBe(await counterValue());

    const old = await call<{ status: string; voidReason: string; replacedBy: { label: string } }>(getInvoice, {
      path: `/api/v1/invoices/${first.id}`,
      params: { id: first.id },
      as: "clerk@brennan-twp.example",
    });
    expect(old.body).toMatchObject({ status: "void", voidReason: "Wrong PO number on the invoice", replacedBy: { label: `INV-${second.number}` } });
    const list = await call<{ invoices: { number: number; status: string }[] }>(listInvoices, { path: "/api/v1/invoices?status=void&limit=200", as: "clerk@brennan-twp.example" });
    expect(list.body.invoices.map((i) => i.number)).toContain(first.number);
    expect(list.body.invoices.every((i) => i.status === "void")).toBe(true);
  });
});

describe("reading invoices by role (api-v1.md)", () => {
  it("a clerk of one account gets 404 on another's invoice and never sees it listed", async () => {
    const wo = await workOrderByNumber(1048);
    const [quarryInvoice] = await getDb().select().from(invoices).where(eq(invoices.workOrderId, wo.id));
    if (!quarryInvoice) throw new Error("fixture");
    const res = await call(getInvoice, { path: `/api/v1/invoices/${quarryInvoice.id}`, params: { id: quarryInvoice.id }, as: "clerk@brennan-twp.example" });
    expect([res.status, res.body.code]).toEqual([404, "not_found"]);
    const pdf = await call(invoicePdf, { path: `/api/v1/invoices/${quarryInvoice.id}/pdf`, params: { id: quarryInvoice.id }, as: "clerk@brennan-twp.example" });
    expect(pdf.status).toBe(404);
    const list = await call<{ invoices: { accountId: string }[] }>(listInvoices, { path: "/api/v1/invoices?limit=200", as: "clerk@brennan-twp.example" });
    expect(list.body.invoices.length).toBeGreaterThan(0);
    expect(list.body.invoices.every((i) => i.accountId !== quarryInvoice.accountId)).toBe(true);
    const none = await call(listInvoices, { path: "/api/v1/invoices" });
    expect(none.status).toBe(401);
    const bad = await call(listInvoices, { path: "/api/v1/invoices?status=partly", as: "clerk@brennan-twp.example" });
    expect([bad.status, bad.body.code]).toEqual([400, "invalid_input"]);
  });

  it("pages with a cursor, newest number first", async () => {
    const first = await call<{ invoices: { number: number }[]; nextCursor: string | null }>(listInvoices, { path: "/api/v1/invoices?limit=3", as: "owner@quarry-road.example" });
    expect(first.body.invoices).toHaveLength(3);
    expect(first.body.nextCursor).not.toBeNull();
    const next = await call<{ invoices: { number: number }[] }>(listInvoices, {
      path: `/api/v1/invoices?limit=3&cursor=${first.body.nextCursor}`,
      as: "owner@quarry-road.example",
    });
    const numbers = [...first.body.invoices, ...next.body.invoices].map((i) => i.number);
    expect(numbers).toEqual([...numbers].sort((a, b) => b - a));
    expect(new Set(numbers).size).toBe(6);
  });
});

describe("the invoice e-mail and PDF", () => {
  it("sends the clerk a link to pay with the PDF attached; the PDF downloads for the account", async () => {
    const wo = await workOrderByNumber(1010);
    const [inv] = await getDb().select().from(invoices).where(eq(invoices.workOrderId, wo.id));
    if (!inv) throw new Error("fixture");
    const arrived = smtp.waitFor((m) => m.to.includes("clerk@brennan-twp.example") && m.subject.includes(`INV-${inv.number}`));
    await writeTx((tx) => queueInvoiceIssued(tx, inv.id));
    const mail = await arrived;
    expect(mail.subject).toBe(`Invoice INV-${inv.number} for unit G-2: $404.30 due ${new Intl.DateTimeFormat("en-US", { month: "short", day: "numeric", year: "numeric", timeZone: "UTC" }).format(new Date(`${inv.dueOn}T12:00:00Z`))}`);
    expect(mail.text).toContain(`http://localhost:3000/fleet/invoices/${inv.id}`);
    expect(mail.text).toContain("BT-2026-0500");
    expect(mail.attachments).toEqual([expect.objectContaining({ filename: `INV-${inv.number}.pdf`, contentType: "application/pdf" })]);

    const pdf = await call<string>(invoicePdf, { path: `/api/v1/invoices/${inv.id}/pdf`, params: { id: inv.id }, as: "clerk@brennan-twp.example" });
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect(pdf.headers.get("content-disposition")).toContain(`INV-${inv.number}.pdf`);
    // PDF 1.3 file structure (ISO 32000-1, 7.5): header and end-of-file marker.
    expect(pdf.body.startsWith("%PDF-1.")).toBe(true);
    expect(pdf.body.trimEnd().endsWith("%%EOF")).toBe(true);
  });
});
