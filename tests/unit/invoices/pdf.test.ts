import { inflateSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { renderInvoicePdf, type InvoiceDocument } from "@/lib/server/pdf/invoice-pdf";

/**
 * Reads back the text pdfkit wrote: content streams are Flate-compressed
 * (ISO 32000-1, 7.4.4) and text is shown with TJ arrays of hex strings in the
 * standard fonts' WinAnsi encoding (ISO 32000-1, 9.4.3 and Annex D).
 */
function pdfText(pdf: Buffer): string {
  const raw = pdf.toString("latin1");
  const out: string[] = [];
  for (const m of raw.matchAll(/stream\r?\n([\s\S]*?)\r?\nendstream/g)) {
    let content: string;
    try {
      content = inflateSync(Buffer.from(m[1] ?? "", "latin1")).toString("latin1");
    } catch {
      continue;
    }
    for (const tj of content.matchAll(/\[(.*?)\]\s*TJ/g)) {
      const pieces = [...(tj[1] ?? "").matchAll(/<([0-9a-fA-F]*)>/g)].map((h) => Buffer.from(h[1] ?? "", "hex").toString("latin1"));
      out.push(pieces.join(""));
    }
  }
  return out.join("\n");
}

const invoice: InvoiceDocument = {
  label: "INV-5101",
  paymentState: "partly_paid",
  issuedAt: "2026-03-02T17:00:00.000Z",
  dueAt: "2026-04-01",
  termsDays: 30,
  poNumber: "BT-2026-0412",
  billTo: { accountName: "Brennan Township Highway Department", address: "40 Township Hall Road\nBrennan Township", email: "clerk@brennan-twp.example", phone: "", contactName: "Ann Mercer" },
  shop: { name: "Quarry Road Truck & Equipment", addressLines: ["1180 Quarry Road", "Alder Falls"], phone: "(555) 010-4417", email: "service@quarry-road.example", footer: "Thank you." },
  unit: { unitNumber: "T-14", description: "Tandem-axle dump with front plow", year: 2014, vin: "0CTDT4517EA108130", serialNumber: null, workOrderNumber: 1042, workOrderTitle: "Plow hydraulics" },
  workOrderNumber: "W-1042",
  taxExemptCertificate: "EX-BT-20417",
  taxRatePercent: 0,
  lines: [
    { kind: "labor", description: "Reseal lift cylinder", partNumber: "", quantityMilli: 2300, unitPriceCents: 14_250, amountCents: 32_775, coreChargeCents: 0 },
    { kind: "part", description: "Brake chamber", partNumber: "BC-3030L", quantityMilli: 2000, unitPriceCents: 9_650, amountCents: 19_300, coreChargeCents: 1_500 },
  ],
  totals: { laborCents: 32_775, partsCents: 19_300, subletCents: 0, feesCents: 0, shopSuppliesCents: 2_622, taxCents: 0, coreCents: 3_000, totalCents: 57_697 },
  paidCents: 20_000,
  // One of the two cores came back after the invoice went out: $576.97 − $200.00 − $15.00 = $361.97.
  creditedCents: 1_500,
  balanceCents: 36_197,
  payments: [{ receivedAt: "2026-03-10T17:00:00.000Z", method: "cheque", reference: "20417", amountCents: 20_000, applied: true, resolution: null }],
  creditNotes: [{ label: "CN-3", issuedAt: "2026-03-12T17:00:00.000Z", reason: "Core returned: Brake chamber", amountCents: 1_500 }],
  voidReason: null,
};

describe("the invoice PDF (issue: shop and account details, PO, lines, totals, terms, due date, payments)", () => {
  it("is a PDF file carrying everything the invoice says", async () => {
    const pdf = await renderInvoicePdf(invoice, "America/Chicago");
    // File header and end-of-file marker: ISO 32000-1, 7.5.2 and 7.5.5.
    expect(pdf.subarray(0, 7).toString("latin1")).toBe("%PDF-1.");
    expect(pdf.toString("latin1").trimEnd().endsWith("%%EOF")).toBe(true);
    const text = pdfText(pdf);
    for (const expected of [
      "Quarry Road Truck & Equipment",
      "1180 Quarry Road",
      "INV-5101",
      "Brennan Township Highway Department",
      "Ann Mercer",
      "Tax exempt, certificate EX-BT-20417",
      "BT-2026-0412",
      "Mar 2, 2026",
      "Apr 1, 2026",
      "Net 30 days",
      "Reseal lift cylinder",
      "Brake chamber (BC-3030L)",
      "2.3 h",
      "$327.75",
      "Core charges (untaxed)",
      "$30.00",
      "$576.97",
      "$361.97",
      "Credited",
      "CN-3  Mar 12, 2026  Core returned: Brake chamber",
      "-$15.00",
      "Cheque  20417",
      "Partly paid",
      "VIN 0CTDT4517EA108130",
    ]) {
      expect(text, expected).toContain(expected);
    }
  });

  it("prints the visit's complaint, cause and correction (the trade's three Cs, common practice on a repair order)", async () => {
    const concerns = [
      { complaint: "Plow drifts down overnight with the valve in hold.", cause: "Lift cylinder piston seals bypassing.", correction: "Resealed the lift cylinder; held 12 h." },
      { complaint: "Annual inspection due next month.", cause: "", correction: "" },
    ];
    const text = pdfText(await renderInvoicePdf({ ...invoice, unit: { ...invoice.unit!, concerns } }, "America/Chicago"));
    for (const expected of ["WORK PERFORMED", "Complaint 1", "Plow drifts down overnight with the valve in hold.", "Lift cylinder piston seals bypassing.", "Resealed the lift cylinder; held 12 h.", "Complaint 2"]) {
      expect(text, expected).toContain(expected);
    }
    // An invoice issued before the three Cs were kept prints none.
    expect(pdfText(await renderInvoicePdf(invoice, "America/Chicago"))).not.toContain("WORK PERFORMED");
  });

  it("says void and that nothing is owed on a void invoice", async () => {
    const pdf = await renderInvoicePdf({ ...invoice, paymentState: "void", voidReason: "Wrong PO.", payments: [] }, "America/Chicago");
    expect(pdfText(pdf)).toContain("VOID: Wrong PO. Nothing is owed on this invoice.");
  });
});
