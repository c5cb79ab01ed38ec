import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { accountStatement } from "@/db/queries/statement";
import { accounts, invoiceLines, invoices } from "@/db/schema";
import { paymentStateOf } from "@/lib/invoices/balance";
import { AGEING_BUCKETS } from "@/lib/receivables/ageing";

// The "Demo data" section: every account has invoices in every state,
// with open balances in every ageing bucket on first start.
describe("demo invoices", () => {
  it("each account has open, partly paid, paid and void invoices and a balance in every bucket", async () => {
    const rows = await getDb().select().from(accounts);
    expect(rows).toHaveLength(3);
    for (const account of rows) {
      const list = await getDb().select().from(invoices).where(eq(invoices.accountId, account.id));
      expect(new Set(list.map(paymentStateOf)), account.name).toEqual(new Set(["open", "partly_paid", "paid", "void"]));
      const statement = await accountStatement({ role: "owner", accountId: null }, account.id, {});
      for (const bucket of AGEING_BUCKETS) expect(statement?.ageing[bucket], `${account.name} ${bucket}`).toBeGreaterThan(0);
    }
  });

  it("numbers run without gaps in issue order, and every total adds up from its lines", async () => {
    const list = await getDb().select().from(invoices).orderBy(invoices.number);
    expect(list.map((i) => i.number)).toEqual(list.map((_, k) => 5001 + k));
    expect(list.map((i) => i.issuedAt)).toEqual([...list.map((i) => i.issuedAt)].sort());
    for (const inv of list) {
      const lines = await getDb().select().from(invoiceLines).where(eq(invoiceLines.invoiceId, inv.id));
      const linesCents = lines.reduce((s, l) => s + l.amountCents, 0);
      expect(linesCents).toBe(inv.laborCents + inv.partsCents + inv.subletCents + inv.feesCents);
      expect(inv.totalCents).toBe(linesCents + inv.shopSuppliesCents + inv.taxCents + inv.coreCents);
    }
    const township = list.filter((i) => i.billTo.accountName === "Brennan Township Highway Department");
    expect(township.length).toBeGreaterThan(0);
    // The township requires a PO number on every invoice.
    for (const inv of township) expect(inv.poNumber).toMatch(/^BT-\d{4}-\d{4}$/);
  });
});
