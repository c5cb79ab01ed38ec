import { describe, expect, it } from "vitest";
import { CSV_COLUMNS, csvField, decimalDollars, toCsv } from "@/lib/invoices/csv";

// Format per RFC 4180 (IETF): CRLF line ends, a header line, fields holding a
// comma, quote or line break enclosed in double quotes with quotes doubled.
// Formula prefixes per OWASP "CSV Injection".
describe("CSV export", () => {
  it("writes amounts as plain decimals", () => {
    expect([124_050, 5, 0, -500].map(decimalDollars)).toEqual(["1240.50", "0.05", "0.00", "-5.00"]);
  });

  it("quotes per RFC 4180 and defuses formulas typed by people", () => {
    expect(csvField("plain")).toBe("plain");
    expect(csvField('PO "A", 12')).toBe('"PO ""A"", 12"');
    expect(csvField("line\r\nbreak")).toBe('"line\r\nbreak"');
    expect(csvField("=SUM(A1:A9)", true)).toBe("'=SUM(A1:A9)");
    expect(csvField("@cmd", true)).toBe("'@cmd");
  });

  it("has a header line and one row per invoice and payment, by date", () => {
    const csv = toCsv(
      [
        {
          issuedOn: "2026-02-01",
          invoice: "INV-5001",
          workOrder: "W-1042",
          unit: "T-14",
          poNumber: "BT-2026-0412",
          state: "partly_paid",
          dueOn: "2026-03-03",
          laborCents: 32_775,
          partsCents: 42_000,
          subletCents: 0,
          feesCents: 0,
          shopSuppliesCents: 2_622,
          taxCents: 0,
          coreCents: 9_000,
          totalCents: 86_397,
          balanceCents: 36_397,
        },
      ],
      [
        {
          receivedOn: "2026-02-10",
          invoice: "INV-5001",
          workOrder: "W-1042",
          unit: "T-14",
          poNumber: "BT-2026-0412",
          status: "applied",
          method: "cheque",
          reference: "Cheque 10442",
          amountCents: 50_000,
        },
      ],
    );
    const lines = csv.split("\r\n");
    expect(csv.endsWith("\r\n")).toBe(true);
    expect(lines[0]).toBe(CSV_COLUMNS.join(","));
    expect(lines[1]).toBe(
      "invoice,2026-02-01,INV-5001,W-1042,T-14,BT-2026-0412,partly_paid,2026-03-03,327.75,420.00,0.00,0.00,26.22,0.00,90.00,863.97,,,,363.97",
    );
    expect(lines[2]).toBe("payment,2026-02-10,INV-5001,W-1042,T-14,BT-2026-0412,applied,,,,,,,,,,cheque,Cheque 10442,500.00,");
    expect(lines).toHaveLength(4);
    expect(lines.every((l) => l === "" || l.split(",").length === CSV_COLUMNS.length)).toBe(true);
  });

  it("writes a credit note as a credit row after the invoice it credits", () => {
    const invoice = { issuedOn: "2026-02-01", invoice: "INV-5001", workOrder: "W-1042", unit: "T-14", poNumber: null, state: "open" as const, dueOn: "2026-03-03",
      laborCents: 0, partsCents: 41_290, subletCents: 0, feesCents: 0, shopSuppliesCents: 0, taxCents: 0, coreCents: 2_500, totalCents: 43_790, balanceCents: 41_290 };
    const credit = { issuedOn: "2026-02-01", creditNote: "CN-1", invoice: "INV-5001", workOrder: "W-1042", unit: "T-14", poNumber: null,
      reason: "Core returned: Drag link, adjustable", amountCents: 2_500 };
    const lines = toCsv([invoice], [], [credit]).split("\r\n");
    expect(lines[1]?.startsWith("invoice,")).toBe(true);
    // The reason holds a comma, so the field is quoted (RFC 4180).
    expect(lines[2]).toBe('credit,2026-02-01,INV-5001,W-1042,T-14,,applied,,,,,,,,,,credit_note,"CN-1: Core returned: Drag link, adjustable",25.00,');
  });
});
