import { describe, expect, it } from "vitest";
import { invoiceIssuedMail } from "@/lib/mail/templates/invoice-issued";
import { paymentFlaggedMail } from "@/lib/mail/templates/payment-flagged";
import { paymentReceiptMail } from "@/lib/mail/templates/payment-receipt";

// What the issue asks each e-mail to carry (invoice issued with a link to pay;
// a receipt for every payment; the shop told of a mismatch).
describe("billing e-mails", () => {
  it("the invoice e-mail names the amount, due date and PO, shows the exemption and links to pay", () => {
    const m = invoiceIssuedMail({
      label: "INV-5101",
      shopName: "Quarry Road Truck & Equipment",
      accountName: "Brennan Township Highway Department",
      unitNumber: "T-14",
      workOrderNumber: "W-1042",
      totalCents: 123_456,
      dueOn: "2026-04-01",
      poNumber: "BT-2026-0412",
      taxExemptCertificate: "EX-BT-20417",
      url: "https://cotter.example/fleet/invoices/abc",
    });
    expect(m.subject).toBe("Invoice INV-5101 for unit T-14: $1,234.56 due Apr 1, 2026");
    expect(m.text).toContain("PO number: BT-2026-0412");
    expect(m.text).toContain("Tax exempt: EX-BT-20417");
    expect(m.text).toContain("View and pay the invoice: https://cotter.example/fleet/invoices/abc");
    expect(m.link).toBe("https://cotter.example/fleet/invoices/abc");
  });

  it("a receipt says what is still open, or that the invoice is paid", () => {
    const base = { label: "INV-5101", shopName: "Quarry Road", amountCents: 20_000, method: "cheque", reference: "20417", receivedAt: "2026-03-10T17:00:00Z", timeZone: "America/Chicago", url: "u", held: false };
    expect(paymentReceiptMail({ ...base, balanceCents: 5_000 }).text).toContain("$50.00 is still open on this invoice.");
    expect(paymentReceiptMail({ ...base, balanceCents: 0 }).text).toContain("The invoice is now paid in full.");
    const held = paymentReceiptMail({ ...base, method: "card", balanceCents: 5_000, held: true });
    expect(held.text).toContain("does not match what was open");
    expect(held.text).toContain("Balance: Unchanged until the shop applies it");
    expect(held.subject).toBe("Receipt: $200.00 for invoice INV-5101");
  });

  it("the shop hears why a card payment was held", () => {
    const m = paymentFlaggedMail({ label: "INV-5101", accountName: "Kettle Ridge Stone Co.", amountCents: 50_000, reason: "Paid $500.00 but the open balance was $400.00.", url: "https://cotter.example/invoices/abc" });
    expect(m.subject).toBe("Check a card payment: $500.00 on INV-5101");
    expect(m.text).toContain("Paid $500.00 but the open balance was $400.00.");
  });
});
