import { describe, expect, it } from "vitest";
import { rateIdFor, sendLabel, switchKind, valuesToLine, type LineFormValues } from "@/components/estimate/line-values";

// The writer's estimate editor (issue "What a week of use turned up", item 5). Labour is billed
// in tenths of an hour (trade convention, product.md "Computation rules").

const rates = [
  { id: "diag", name: "Diagnosis", rateCents: 15_500, isDefault: false },
  { id: "shop", name: "Shop rate", rateCents: 14_250, isDefault: true },
];
const taxDefaults = { labor: false, part: true, sublet: false, fee: false };
const labour: LineFormValues = { kind: "labor", description: "Reseal", partNumber: "", quantity: "1.5", unitPrice: "142.50", taxable: false, coreCharge: "", concernId: "", isDiagnosis: true };

describe("line form values", () => {
  it("an invalid 1.55 h of labour has no price preview, and says why", () => {
    expect(valuesToLine({ ...labour, quantity: "1.55" })).toMatchObject({ ok: false, problem: "Labour is in tenths of an hour, like 1.5 or 0.3." });
    expect(valuesToLine({ ...labour, quantity: "1.5" })).toEqual({ ok: true, quantityMilli: 1500, unitPriceCents: 14_250 });
    // Parts may be decimal (fluids): 1.55 gal is fine.
    expect(valuesToLine({ ...labour, kind: "part", quantity: "1.55" })).toMatchObject({ ok: true, quantityMilli: 1550 });
  });

  it("switching a labour line to Part drops the labour rate as its price (and diagnosis); back to labour takes the default rate", () => {
    const part = switchKind(labour, "part", rates, taxDefaults);
    expect(part).toMatchObject({ kind: "part", unitPrice: "", taxable: true, isDiagnosis: false });
    expect(switchKind(part, "labor", rates, taxDefaults)).toMatchObject({ kind: "labor", unitPrice: "142.50", taxable: false });
    // A part with its own price keeps it when it becomes a sublet.
    expect(switchKind({ ...part, unitPrice: "64.50" }, "sublet", rates, taxDefaults).unitPrice).toBe("64.50");
  });

  it("the rate picker shows the rate the price is, instead of snapping back to “Pick a rate…”", () => {
    expect(rateIdFor("155.00", rates)).toBe("diag");
    expect(rateIdFor("142.5", rates)).toBe("shop");
    expect(rateIdFor("120.00", rates)).toBe("");
  });

  it("a send button with nothing to send says so, not “Send 0 draft lines”", () => {
    expect(sendLabel(0, "Brennan Township Highway Department", false)).toBe("No draft lines to send");
    expect(sendLabel(1, "Kettle Ridge Stone Co.", false)).toBe("Send 1 draft line to Kettle Ridge Stone Co.");
    expect(sendLabel(3, "Kettle Ridge Stone Co.", false)).toBe("Send 3 draft lines to Kettle Ridge Stone Co.");
  });
});
