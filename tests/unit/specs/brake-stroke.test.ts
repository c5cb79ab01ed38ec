import { describe, expect, it } from "vitest";
import { CLAMP_STROKE_LIMITS_IN, ReadingInputError, checkReading, strokeLimitFor, tryCheckReading } from "@/lib/specs";
import type { BrakeStrokeInput, ClampChamberType, StrokeClass } from "@/lib/specs";

const stroke = (chamberType: BrakeStrokeInput["chamberType"], strokeClass: StrokeClass, value: number, extra: Partial<BrakeStrokeInput> = {}) =>
  checkReading({ kind: "brake_stroke", chamberType, strokeClass, value, ...extra });

// 49 CFR 393.47(e)(1) table rows as reprinted in reference-values.md. The regulation's
// wording was confirmed in a stored eCFR copy; the rows could not be read there.
const ROWS: [ClampChamberType, StrokeClass, number, string][] = [
  [6, "standard", 1.25, "1¼"],
  [9, "standard", 1.375, "1⅜"],
  [12, "standard", 1.375, "1⅜"],
  [12, "long_stroke", 1.75, "1¾"],
  [16, "standard", 1.75, "1¾"],
  [16, "long_stroke", 2, "2"],
  [20, "standard", 1.75, "1¾"],
  [20, "long_stroke", 2, "2"],
  [20, "long_stroke_3in", 2.5, "2½"],
  [24, "standard", 1.75, "1¾"],
  [24, "long_stroke", 2, "2"],
  [24, "long_stroke_3in", 2.5, "2½"],
  [30, "standard", 2, "2"],
  [30, "long_stroke", 2.5, "2½"],
  [36, "standard", 2.25, "2¼"],
];

describe("clamp-type chamber readjustment limits — 49 CFR 393.47(e)(1) table (rows as reprinted in reference-values.md)", () => {
  it.each(ROWS)("49 CFR 393.47(e)(1): type %i %s limit is %d in", (type, cls, limit, text) => {
    expect(CLAMP_STROKE_LIMITS_IN[type][cls]).toBe(limit);
    const r = stroke(type, cls, limit);
    expect(r).toMatchObject({ verdict: "at_limit", limitValue: limit, unit: "in", source: "49 CFR 393.47(e)(1)", sourceKind: "published" });
    expect(r.limit).toContain(`≤ ${text} in (type ${type}`);
    expect(stroke(type, cls, limit + 0.0625).verdict).toBe("beyond");
    expect(stroke(type, cls, limit - 0.0625).verdict).toBe("within");
  });

  it("the table has exactly the 15 rows of reference-values.md (no long-stroke row for types 6, 9, 36)", () => {
    const count = Object.values(CLAMP_STROKE_LIMITS_IN).reduce((n, row) => n + Object.keys(row).length, 0);
    expect(count).toBe(ROWS.length);
    expect(CLAMP_STROKE_LIMITS_IN[36].long_stroke).toBeUndefined();
  });
});

describe("brake stroke edge — 'must not be greater than' (393.47(e)(1)); 'exceeding … rejected' (Part 396 App. A 1.a(5))", () => {
  it("49 CFR 393.47(e)(1) edge: a type 30 stroke of exactly 2 in is allowed → at_limit", () => {
    expect(stroke(30, "standard", 2).verdict).toBe("at_limit");
  });

  it("49 CFR 393.47(e)(1) edge: 2.0001 in on a type 30 standard is beyond", () => {
    expect(stroke(30, "standard", 2.0001).verdict).toBe("beyond");
  });

  it("49 CFR 393.47(e)(1) edge: 1.9999 in on a type 30 standard is within", () => {
    expect(stroke(30, "standard", 1.9999).verdict).toBe("within");
  });

  it("accepts fractions written as decimals: 1.75 in is 1¾ at the type 24 standard limit", () => {
    const r = stroke(24, "standard", 1.75);
    expect(r.verdict).toBe("at_limit");
    expect(r.limit).toBe("≤ 1¾ in (type 24, standard stroke)");
  });

  it("reports the margin to the limit in inches (negative when over)", () => {
    expect(stroke(30, "long_stroke", 2.25).derived?.value).toBeCloseTo(0.25, 10);
    expect(stroke(30, "standard", 2.125).derived?.value).toBeCloseTo(-0.125, 10);
  });

  it("notes how to measure: engine off, 80–90 psi, brakes fully applied (Part 396 Appendix A, 1.a(5))", () => {
    expect(stroke(30, "standard", 1.5).note).toMatch(/80–90 psi/);
  });
});

describe("actuators not in the table — 49 CFR 393.47(e)(2): 80 % of rated stroke, or the marked limit", () => {
  it("49 CFR 393.47(e)(2): 80 % of a 2½ in rated stroke is 2 in; exactly 2 in → at_limit", () => {
    const r = stroke("other", "standard", 2, { ratedStrokeIn: 2.5 });
    expect(r).toMatchObject({ verdict: "at_limit", limitValue: 2, source: "49 CFR 393.47(e)(2)" });
    expect(r.limit).toBe("≤ 2 in (80 % of the 2½ in rated stroke)");
    expect(stroke("other", "standard", 2.0625, { ratedStrokeIn: 2.5 }).verdict).toBe("beyond");
  });

  it("49 CFR 393.47(e)(2): 80 % of 2¼ in is 1.8 in, compared exactly", () => {
    expect(strokeLimitFor({ chamberType: "other", strokeClass: "standard", ratedStrokeIn: 2.25 }).inches).toBeCloseTo(1.8, 10);
    expect(stroke("other", "standard", 1.8, { ratedStrokeIn: 2.25 }).verdict).toBe("at_limit");
    expect(stroke("other", "standard", 1.8001, { ratedStrokeIn: 2.25 }).verdict).toBe("beyond");
  });

  it("49 CFR 393.47(e)(2): the limit marked on the actuator is used when entered", () => {
    const r = stroke("other", "standard", 1.9, { markedLimitIn: 1.9, ratedStrokeIn: 3 });
    expect(r).toMatchObject({ verdict: "at_limit", limitValue: 1.9 });
    expect(r.limit).toContain("marked on the actuator");
  });

  it("49 CFR 393.47(e)(2): a type 36 long-stroke (no table row) uses the rated stroke: 80 % of 3 in = 2.4 in", () => {
    const r = stroke(36, "long_stroke", 2.4, { ratedStrokeIn: 3 });
    expect(r.verdict).toBe("at_limit");
    expect(r.limitValue).toBeCloseTo(2.4, 10);
  });

  it("refuses a chamber not in the table when neither rated stroke nor marked limit is given", () => {
    expect(() => stroke(36, "long_stroke", 2)).toThrow(ReadingInputError);
    expect(() => stroke("other", "standard", 2)).toThrow(/rated stroke/);
    const outcome = tryCheckReading({ kind: "brake_stroke", chamberType: 30, strokeClass: "long_stroke_3in", value: 2 });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.message).toContain("Type 30 long-stroke, 3 in rated stroke is not in the 49 CFR 393.47(e)(1) table");
  });

  it("refuses a negative stroke", () => {
    expect(() => stroke(30, "standard", -0.5)).toThrow(/cannot be below 0/);
  });
});
