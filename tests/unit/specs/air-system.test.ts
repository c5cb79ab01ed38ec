import { describe, expect, it } from "vitest";
import { checkReading } from "@/lib/specs";
import type { AirLeakInput } from "@/lib/specs";

const CDL = "CDL manual, air brakes section";
const leak = (brakes: AirLeakInput["brakes"], vehicle: AirLeakInput["vehicle"], value: number) =>
  checkReading({ kind: "air_leak", brakes, vehicle, value });

describe(`air leakage — ${CDL} (final air brake check)`, () => {
  it.each([
    ["released", "single", 2],
    ["released", "combination", 3],
  ] as const)(`${CDL}: brakes %s, %s vehicle — "less than" %d psi/min: that figure itself is beyond`, (brakes, vehicle, limit) => {
    const at = leak(brakes, vehicle, limit);
    expect(at).toMatchObject({ verdict: "beyond", limitValue: limit, unit: "psi/min", sourceKind: "published" });
    expect(at.source).toContain(CDL);
    expect(leak(brakes, vehicle, limit - 0.5).verdict).toBe("within");
    expect(leak(brakes, vehicle, limit + 0.5).verdict).toBe("beyond");
  });

  it.each([
    ["applied", "single", 3],
    ["applied", "combination", 4],
  ] as const)(`${CDL}: brakes %s, %s vehicle — "more than" %d psi/min is too much: that figure itself is at limit`, (brakes, vehicle, limit) => {
    const at = leak(brakes, vehicle, limit);
    expect(at).toMatchObject({ verdict: "at_limit", limitValue: limit, unit: "psi/min", sourceKind: "published" });
    expect(leak(brakes, vehicle, limit - 0.5).verdict).toBe("within");
    expect(leak(brakes, vehicle, limit + 0.5).verdict).toBe("beyond");
  });

  it(`${CDL} edge: released single at 2.01 psi/min is beyond, 1.99 within`, () => {
    expect(leak("released", "single", 2.01).verdict).toBe("beyond");
    expect(leak("released", "single", 1.99).verdict).toBe("within");
  });

  it(`${CDL}: the limit text says which test (released "less than", applied "not more than")`, () => {
    expect(leak("released", "single", 1).limit).toMatch(/^less than 2 psi\/min \(single vehicle, brakes released/);
    expect(leak("applied", "combination", 1).limit).toMatch(/^not more than 4 psi\/min \(combination, brakes applied/);
  });
});

describe(`governor cut-in / cut-out — ${CDL}: about 100 / 125 psi, maker's figures govern (tolerance ours)`, () => {
  it(`${CDL}: cut-in about 100 psi; ±5 psi within, marked common_practice`, () => {
    const r = checkReading({ kind: "governor_cut_in", value: 100 });
    expect(r).toMatchObject({ verdict: "within", limitValue: 100, sourceKind: "common_practice" });
    expect(checkReading({ kind: "governor_cut_in", value: 95 }).verdict).toBe("within");
    expect(checkReading({ kind: "governor_cut_in", value: 105 }).verdict).toBe("within");
  });

  it("edge: 5.5 psi off is at_limit; 10 psi off still at_limit; 10.5 psi off beyond (common practice band)", () => {
    expect(checkReading({ kind: "governor_cut_in", value: 94.5 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "governor_cut_in", value: 90 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "governor_cut_in", value: 89.5 }).verdict).toBe("beyond");
  });

  it(`${CDL}: cut-out about 125 psi`, () => {
    expect(checkReading({ kind: "governor_cut_out", value: 125 })).toMatchObject({ verdict: "within", limitValue: 125 });
    expect(checkReading({ kind: "governor_cut_out", value: 132 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "governor_cut_out", value: 140 }).verdict).toBe("beyond");
  });

  it("uses the unit's specified figure when entered (maker's figures govern)", () => {
    const r = checkReading({ kind: "governor_cut_out", value: 130, specPsi: 130 });
    expect(r).toMatchObject({ verdict: "within", limitValue: 130 });
    expect(r.limit).toContain("figure specified for this unit");
    expect(r.note).toMatch(/maker's figure governs/);
  });
});

describe(`low-air warning — ${CDL}: must come on before the tank falls below 60 psi`, () => {
  it(`${CDL}: 60 psi is the published minimum; 65 psi within`, () => {
    expect(checkReading({ kind: "low_air_warning", value: 65 })).toMatchObject({ verdict: "within", limitValue: 60, sourceKind: "published" });
  });

  it(`${CDL} edge: on at exactly 60 psi → at_limit`, () => {
    expect(checkReading({ kind: "low_air_warning", value: 60 }).verdict).toBe("at_limit");
  });

  it(`${CDL} edge: on only at 59.5 psi → beyond`, () => {
    expect(checkReading({ kind: "low_air_warning", value: 59.5 }).verdict).toBe("beyond");
  });
});

describe(`spring brakes apply — ${CDL}: between 20 and 45 psi`, () => {
  it(`${CDL}: 30 psi is within the 20–45 psi range`, () => {
    expect(checkReading({ kind: "spring_brake_apply", value: 30 })).toMatchObject({ verdict: "within", sourceKind: "published" });
  });

  it(`${CDL} edge: exactly 20 and exactly 45 psi → at_limit, naming the near end`, () => {
    expect(checkReading({ kind: "spring_brake_apply", value: 20 })).toMatchObject({ verdict: "at_limit", limitValue: 20 });
    expect(checkReading({ kind: "spring_brake_apply", value: 45 })).toMatchObject({ verdict: "at_limit", limitValue: 45 });
  });

  it(`${CDL} edge: 19.5 and 45.5 psi → beyond`, () => {
    expect(checkReading({ kind: "spring_brake_apply", value: 19.5 }).verdict).toBe("beyond");
    expect(checkReading({ kind: "spring_brake_apply", value: 45.5 }).verdict).toBe("beyond");
  });
});

describe(`air build-up — ${CDL}: 85 → 100 psi within 45 s (dual air systems)`, () => {
  it(`${CDL}: 30 s within, limit 45 s`, () => {
    expect(checkReading({ kind: "air_buildup", value: 30 })).toMatchObject({ verdict: "within", limitValue: 45, unit: "s" });
  });

  it(`${CDL} edge: exactly 45 s → at_limit; 45.5 s → beyond`, () => {
    expect(checkReading({ kind: "air_buildup", value: 45 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "air_buildup", value: 45.5 }).verdict).toBe("beyond");
  });
});
