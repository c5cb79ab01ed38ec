// Words people read: the small helpers that build them, checked against the sentences a
// practitioner expects (issue "What a week of use turned up", item 9).
import { describe, expect, it } from "vitest";
import { asSentence } from "@/lib/format";
import { formatPriceOf } from "@/lib/invoices/format";
import { checkReading, sourceLine } from "@/lib/specs";

describe("a refusal followed by advice reads as two sentences", () => {
  it("adds the full stop the server's detail lacks and capitalises it", () => {
    expect(asSentence("approving $5,200.00 would bring your approvals on W-1043 to $5,899.90; your signing limit is $5,000.00")).toBe(
      "Approving $5,200.00 would bring your approvals on W-1043 to $5,899.90; your signing limit is $5,000.00.",
    );
  });
  it("leaves a sentence that already ends alone", () => {
    expect(asSentence("Nothing was decided.")).toBe("Nothing was decided.");
    expect(asSentence("Is that right?")).toBe("Is that right?");
  });
});

describe("a reading's source names its kind once", () => {
  it("does not add “(common practice)” to a source that already says common practice, in any case or form", () => {
    for (const input of [
      { kind: "cranking_voltage", value: 11 } as const,
      { kind: "key_off_drain", value: 30, unitLimitMa: 120 } as const,
      { kind: "key_off_drain", value: 30 } as const,
      { kind: "battery_load_test", value: 9.9, temperature: 70 } as const,
    ]) {
      const r = checkReading(input);
      const line = sourceLine(r.source, r.sourceKind);
      expect(line.match(/common practice/gi), line).toHaveLength(1);
    }
  });
  it("adds the kind when the source does not say it", () => {
    expect(sourceLine("49 CFR 393.47(e)(1)", "published")).toBe("49 CFR 393.47(e)(1) (published)");
    expect(sourceLine("Roadside inspection criteria", "from_memory")).toBe("Roadside inspection criteria (from memory)");
  });
});

describe("an invoice line says how its price is counted", () => {
  it("labour reads as hours at a rate, never “$142.50 each” (labour is billed in tenths of an hour)", () => {
    expect(formatPriceOf(1_500, 14_250, "labor")).toBe("1.5 h at $142.50/h");
  });
  it("parts read as quantity × unit price", () => {
    expect(formatPriceOf(2_000, 19_495, "part")).toBe("2 × $194.95");
    expect(formatPriceOf(12_000, 185, "part")).toBe("12 × $1.85");
  });
  it("a single sublet or fee is just its price", () => {
    expect(formatPriceOf(1_000, 18_500, "sublet")).toBe("$185.00");
  });
});
