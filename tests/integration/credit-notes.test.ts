// Credit notes (issue: "corrections are a void plus a new invoice (or a
// credit), both kept") and a core that comes back after the invoice went out
// (product.md: core charges "credited when the core is returned"). An issued
// invoice never changes; a credit lowers what is owed and never past it.
// Amounts: line amount = quantity × price (product.md computation rules).
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as exportCsv } from "@/app/api/v1/accounts/[id]/export/route";
import { GET as getInvoice } from "@/app/api/v1/invoices/[id]/route";
import { getDb, writeTx } from "@/db/client";
import { setCoreReturned } from "@/db/queries/core-returns";
import { issueCreditNote } from "@/db/queries/credit-notes";
import { issueInvoice } from "@/db/queries/invoice-issue";
import { getInvoiceDetail } from "@/db/queries/invoices";
import { recordManualPayment, voidInvoice } from "@/db/queries/payments";
import { creditNotes, invoices } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { queueCreditNote } from "@/lib/server/notifications/invoices";
import { formatCents } from "@/lib/money";
import { call } from "./helpers/app";
import { asUser, setLines } from "./helpers/billing";
import { workOrderByNumber } from "./helpers/work-orders";
import { fileMailbox } from "./helpers/mail";

const WRITER = "writer@quarry-road.example";
const OFFICE = "office@kettle-ridge.example"; // approver, Kettle Ridge (owns Haul 5, W-1048)

let invoiceId = "";
let accountId = "";
let sensorLineId = "";
const smtp = fileMailbox();

afterAll(async () => {
  delete process.env.SMTP_URL;
  resetEnvCache();
});

beforeAll(async () => {
  resetEnvCache();
  const wo = await workOrderByNumber(1048);
  accountId = wo.accountId;
  [, sensorLineId] = (await setLines(wo.id, [
    { kind: "labor", description: "Trace ABS fault", quantityMilli: 1000, unitPriceCents: 14_250 },
    // Two sensors at $64.80 with a $15.00 core each: cores on the invoice $30.00.
    { kind: "part", description: "Wheel-speed sensor", quantityMilli: 2000, unitPriceCents: 6_480, taxable: true, coreChargeCents: 1_500 },
  ])) as [string, string];
  invoiceId = (await issueInvoice(await asUser(WRITER), wo.id, {})).id;
});

async function detail() {
  return (await getInvoiceDetail({ role: "owner", accountId: null }, invoiceId))!;
}

describe("credit notes on an issued invoice", () => {
  it("credits a core that came back after invoicing, as a numbered credit note; the invoice lines stay as issued", async () => {
    const before = await detail();
    expect(before.totals.coreCents).toBe(3_000);
    const result = await setCoreReturned(await asUser(WRITER), sensorLineId, true);
    expect(result.creditNote?.label).toBe("CN-1");
    // The account's billing address hears of it, with what is still owed.
    const mail = smtp.waitFor((m) => m.to.includes(OFFICE) && m.subject === "Credit CN-1: $30.00 off invoice " + before.label);
    await writeTx((tx) => queueCreditNote(tx, result.creditNote!.id));
    expect((await mail).text).toContain(`${formatCents(before.totalCents - 3_000)} is still open on this invoice.`);
    const after = await detail();
    expect(after.lines).toEqual(before.lines);
    expect(after.totalCents).toBe(before.totalCents);
    expect(after.creditedCents).toBe(3_000);
    expect(after.balanceCents).toBe(before.totalCents - 3_000);
    expect(after.creditNotes).toMatchObject([{ label: "CN-1", amountCents: 3_000, reason: "Core returned: Wheel-speed sensor" }]);
    // An issued invoice and its credit notes do not change back.
    await expect(setCoreReturned(await asUser(WRITER), sensorLineId, false)).rejects.toMatchObject({ status: 409, code: "already_invoiced" });
  });

  it("refuses a credit past the open balance and changes nothing", async () => {
    await recordManualPayment(await asUser(WRITER), invoiceId, { method: "cheque", amountCents: 10_000, reference: "3301", receivedAt: new Date().toISOString() });
    const before = await detail();
    const [rowBefore] = await getDb().select().from(invoices).where(eq(invoices.id, invoiceId));
    const error = await issueCreditNote(await asUser(WRITER), invoiceId, { amountCents: before.balanceCents + 1, reason: "Too much" }).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 409, code: "credit_refused" });
    expect(String((error as Error).message)).toContain("more than the open balance");
    expect(await getDb().select().from(invoices).where(eq(invoices.id, invoiceId))).toEqual([rowBefore]);
    expect((await getDb().select({ n: count() }).from(creditNotes))[0]!.n).toBe(1);
  });

  it("settles the invoice when a credit covers the rest, numbers without gaps, then refuses more", async () => {
    const { balanceCents } = await detail();
    const cn = await issueCreditNote(await asUser(WRITER), invoiceId, { amountCents: balanceCents, reason: "Labour rate put right" });
    expect(cn).toMatchObject({ label: "CN-2", status: "paid", balanceCents: 0 });
    expect((await detail()).paymentState).toBe("paid");
    await expect(issueCreditNote(await asUser(WRITER), invoiceId, { amountCents: 100, reason: "More" })).rejects.toMatchObject({ status: 409, code: "credit_refused" });
  });

  it("is not found for another account, and an invoice with a credit cannot be voided", async () => {
    await expect(issueCreditNote(await asUser("supervisor@brennan-twp.example"), invoiceId, { amountCents: 100, reason: "Not mine" })).rejects.toMatchObject({ status: 404 });
    const wo = await workOrderByNumber(1049); // township: PO required
    await setLines(wo.id, [{ kind: "labor", description: "Repair liftgate ground", quantityMilli: 1300, unitPriceCents: 14_250 }]);
    const other = await issueInvoice(await asUser(WRITER), wo.id, { poNumber: "BT-2026-0999" });
    await issueCreditNote(await asUser(WRITER), other.id, { amountCents: 500, reason: "Goodwill" });
    await expect(voidInvoice(await asUser(WRITER), other.id, "Wrong unit")).rejects.toMatchObject({ status: 409, code: "has_credit_notes" });
  });

  it("shows the credits to the fleet through the API and in the CSV export", async () => {
    const res = await call<{ creditedCents: number; balanceCents: number; creditNotes: { label: string }[] }>(getInvoice, {
      path: `/api/v1/invoices/${invoiceId}`,
      params: { id: invoiceId },
      as: OFFICE,
    });
    expect(res.status).toBe(200);
    expect(res.body.creditNotes.map((c) => c.label)).toEqual(["CN-1", "CN-2"]);
    expect(res.body.balanceCents).toBe(0);
    const today = calendarDate(new Date());
    const csv = await call<string>(exportCsv, { path: `/api/v1/accounts/${accountId}/export?from=${today}&to=${today}`, params: { id: accountId }, as: OFFICE });
    expect(csv.status).toBe(200);
    const credits = csv.body.split("\r\n").filter((l) => l.startsWith("credit,"));
    expect(credits).toHaveLength(2);
    expect(credits[0]).toContain("credit_note,CN-1: Core returned: Wheel-speed sensor,30.00");
  });
});
