// Every check in lib/specs at both edges of every limit, each edge in a test of its own, with the
// rule's wording quoted beside it. What the verdicts mean (reference-values.md):
//   Within limit — passes. At limit — still passes, but exactly at a limit the rule allows, or
//   inside a caution band the check documents. Beyond limit — fails; a value exactly at a figure
//   the rule says must not be reached is beyond.
import { describe, expect, it } from "vitest";
import { brakeOutOfServiceSummary, checkReading, CLAMP_STROKE_LIMITS_IN, type ReadingInput } from "@/lib/specs";

const verdict = (input: ReadingInput) => checkReading(input).verdict;

describe("tyre tread depth — published: 49 CFR 393.75(b), (c)", () => {
  const RULE_B = "393.75(b): front (steering) axle tyres “at least 4/32 in” in a major tread groove";
  const RULE_C = "393.75(c): all other tyres “at least 2/32 in”";
  it(`${RULE_B} — exactly 4/32 in is allowed: at limit`, () => {
    expect(verdict({ kind: "tread_depth", position: "steer", value: 4, unit: "32nds" })).toBe("at_limit");
  });
  it(`${RULE_B} — just under (3.99/32 in) is beyond`, () => {
    expect(verdict({ kind: "tread_depth", position: "steer", value: 3.99, unit: "32nds" })).toBe("beyond");
  });
  it(`${RULE_B} — just over (4.01/32 in) is within`, () => {
    expect(verdict({ kind: "tread_depth", position: "steer", value: 4.01, unit: "32nds" })).toBe("within");
  });
  it(`${RULE_B} — in mm: 4/32 in is 3.175 mm exactly (at limit); 3.1749 mm beyond; 3.1751 mm within`, () => {
    expect(verdict({ kind: "tread_depth", position: "steer", value: 3.175, unit: "mm" })).toBe("at_limit");
    expect(verdict({ kind: "tread_depth", position: "steer", value: 3.1749, unit: "mm" })).toBe("beyond");
    expect(verdict({ kind: "tread_depth", position: "steer", value: 3.1751, unit: "mm" })).toBe("within");
  });
  it(`${RULE_C} — exactly 2/32 in is allowed: at limit`, () => {
    expect(verdict({ kind: "tread_depth", position: "other", value: 2, unit: "32nds" })).toBe("at_limit");
  });
  it(`${RULE_C} — just under (1.99/32 in) is beyond`, () => {
    expect(verdict({ kind: "tread_depth", position: "other", value: 1.99, unit: "32nds" })).toBe("beyond");
  });
  it(`${RULE_C} — just over (2.01/32 in) is within`, () => {
    expect(verdict({ kind: "tread_depth", position: "other", value: 2.01, unit: "32nds" })).toBe("within");
  });
  it(`${RULE_C} — in mm: 2/32 in is 1.5875 mm exactly (at limit); 1.5874 mm beyond`, () => {
    expect(verdict({ kind: "tread_depth", position: "other", value: 1.5875, unit: "mm" })).toBe("at_limit");
    expect(verdict({ kind: "tread_depth", position: "other", value: 1.5874, unit: "mm" })).toBe("beyond");
  });
});

describe("brake pushrod stroke — published: 49 CFR 393.47(e)", () => {
  const RULE = "393.47(e)(1): “the pushrod stroke must not be greater than the values specified”; Part 396 App. A: “any brake stroke exceeding the readjustment limit will be rejected”";
  const rows = Object.entries(CLAMP_STROKE_LIMITS_IN).flatMap(([type, classes]) =>
    Object.entries(classes).map(([strokeClass, limit]) => ({ type: Number(type), strokeClass, limit: limit! })),
  );
  const stroke = (type: number, strokeClass: string, value: number) =>
    verdict({ kind: "brake_stroke", chamberType: type as 30, strokeClass: strokeClass as "standard", value });
  it.each(rows)(`${RULE} — type $type $strokeClass: exactly $limit in is allowed (at limit)`, ({ type, strokeClass, limit }) => {
    expect(stroke(type, strokeClass, limit)).toBe("at_limit");
  });
  it.each(rows)(`${RULE} — type $type $strokeClass: 1/10 000 in over $limit in is beyond`, ({ type, strokeClass, limit }) => {
    expect(stroke(type, strokeClass, limit + 0.0001)).toBe("beyond");
  });
  it.each(rows)(`${RULE} — type $type $strokeClass: 1/10 000 in under $limit in is within`, ({ type, strokeClass, limit }) => {
    expect(stroke(type, strokeClass, limit - 0.0001)).toBe("within");
  });
  const RULE_E2 = "393.47(e)(2): a type not in the table — 80 % of the rated stroke (2.5 in rated → 2 in)";
  it(`${RULE_E2} — exactly 2 in is at limit`, () => {
    expect(verdict({ kind: "brake_stroke", chamberType: "other", strokeClass: "standard", ratedStrokeIn: 2.5, value: 2 })).toBe("at_limit");
  });
  it(`${RULE_E2} — 2.0001 in is beyond; 1.9999 in within`, () => {
    expect(verdict({ kind: "brake_stroke", chamberType: "other", strokeClass: "standard", ratedStrokeIn: 2.5, value: 2.0001 })).toBe("beyond");
    expect(verdict({ kind: "brake_stroke", chamberType: "other", strokeClass: "standard", ratedStrokeIn: 2.5, value: 1.9999 })).toBe("within");
  });
  it("393.47(e)(2): “the limit marked on the actuator” — exactly the marked 2¼ in is at limit, 2.2501 in beyond", () => {
    expect(verdict({ kind: "brake_stroke", chamberType: "other", strokeClass: "standard", markedLimitIn: 2.25, value: 2.25 })).toBe("at_limit");
    expect(verdict({ kind: "brake_stroke", chamberType: "other", strokeClass: "standard", markedLimitIn: 2.25, value: 2.2501 })).toBe("beyond");
  });
});

describe("brake out-of-service screen — from memory (inspection criteria), not confirmed in a text", () => {
  const RULE = "“a brake ¼ in or more over its limit counts as one defective brake”";
  const type30 = (value: number) => ({ chamberType: 30 as const, strokeClass: "standard" as const, value });
  it(`${RULE} — exactly ¼ in over (2¼ in on a 2 in limit) is defective`, () => {
    expect(brakeOutOfServiceSummary([type30(2.25)]).brakes[0]).toMatchObject({ verdict: "beyond", defective: true });
  });
  it(`${RULE} — 1/10 000 in short of ¼ in over is over the limit but not defective`, () => {
    expect(brakeOutOfServiceSummary([type30(2.2499)]).brakes[0]).toMatchObject({ verdict: "beyond", defective: false });
  });
  const SHARE = "“20 % or more of its service brakes defective is out of service”";
  it(`${SHARE} — exactly 20 % (2 of 10) is out of service`, () => {
    const strokes = [type30(2.5), type30(2.5), ...Array.from({ length: 8 }, () => type30(1.5))];
    expect(brakeOutOfServiceSummary(strokes)).toMatchObject({ defective: 2, defectivePercent: 20, outOfService: true });
  });
  it(`${SHARE} — under 20 % (1 of 6, 16.7 %) is not`, () => {
    const strokes = [type30(2.5), ...Array.from({ length: 5 }, () => type30(1.5))];
    expect(brakeOutOfServiceSummary(strokes)).toMatchObject({ defective: 1, defectivePercent: 16.7, outOfService: false });
  });
});

describe("air brake checks — published: CDL manual, air brakes section (final air brake check)", () => {
  const leak = (brakes: "released" | "applied", vehicle: "single" | "combination", value: number) =>
    verdict({ kind: "air_leak", brakes, vehicle, value });
  const RELEASED = "leakage with brakes released, engine off: “less than 2 psi/min (single vehicle), 3 psi/min (combination)”";
  it(`${RELEASED} — exactly 2 psi/min (single) must not be reached: beyond`, () => {
    expect(leak("released", "single", 2)).toBe("beyond");
  });
  it(`${RELEASED} — 1.99 psi/min (single) is within`, () => {
    expect(leak("released", "single", 1.99)).toBe("within");
  });
  it(`${RELEASED} — exactly 3 psi/min (combination) must not be reached: beyond`, () => {
    expect(leak("released", "combination", 3)).toBe("beyond");
  });
  it(`${RELEASED} — 2.99 psi/min (combination) is within`, () => {
    expect(leak("released", "combination", 2.99)).toBe("within");
  });
  const APPLIED = "leakage with brakes applied: “more than 3 psi/min (single) or 4 psi/min (combination) is too much”";
  it(`${APPLIED} — exactly 3 psi/min (single) is allowed: at limit`, () => {
    expect(leak("applied", "single", 3)).toBe("at_limit");
  });
  it(`${APPLIED} — 3.01 psi/min (single) is beyond; 2.99 within`, () => {
    expect(leak("applied", "single", 3.01)).toBe("beyond");
    expect(leak("applied", "single", 2.99)).toBe("within");
  });
  it(`${APPLIED} — exactly 4 psi/min (combination) is allowed: at limit`, () => {
    expect(leak("applied", "combination", 4)).toBe("at_limit");
  });
  it(`${APPLIED} — 4.01 psi/min (combination) is beyond; 3.99 within`, () => {
    expect(leak("applied", "combination", 4.01)).toBe("beyond");
    expect(leak("applied", "combination", 3.99)).toBe("within");
  });

  const GOVERNOR = "governor: “cuts in at about 100 psi, cuts out at about 125 psi (maker's figures govern)”; our caution band (common practice): within ±5 psi, at limit ±5–10 psi";
  it.each([
    ["governor_cut_in", 100],
    ["governor_cut_out", 125],
  ] as const)(`${GOVERNOR} — %s: exactly ±5 psi of %d is within`, (kind, figure) => {
    expect(verdict({ kind, value: figure - 5 })).toBe("within");
    expect(verdict({ kind, value: figure + 5 })).toBe("within");
  });
  it.each([
    ["governor_cut_in", 100],
    ["governor_cut_out", 125],
  ] as const)(`${GOVERNOR} — %s: just past ±5 psi of %d enters the caution band (at limit)`, (kind, figure) => {
    expect(verdict({ kind, value: figure - 5.01 })).toBe("at_limit");
    expect(verdict({ kind, value: figure + 5.01 })).toBe("at_limit");
  });
  it.each([
    ["governor_cut_in", 100],
    ["governor_cut_out", 125],
  ] as const)(`${GOVERNOR} — %s: exactly ±10 psi of %d is still in the band (at limit)`, (kind, figure) => {
    expect(verdict({ kind, value: figure - 10 })).toBe("at_limit");
    expect(verdict({ kind, value: figure + 10 })).toBe("at_limit");
  });
  it.each([
    ["governor_cut_in", 100],
    ["governor_cut_out", 125],
  ] as const)(`${GOVERNOR} — %s: just past ±10 psi of %d is beyond`, (kind, figure) => {
    expect(verdict({ kind, value: figure - 10.01 })).toBe("beyond");
    expect(verdict({ kind, value: figure + 10.01 })).toBe("beyond");
  });

  const LOW_AIR = "low-air warning: “must come on before pressure falls below 60 psi”";
  it(`${LOW_AIR} — on at exactly 60 psi: the pressure has not fallen below 60, allowed (at limit)`, () => {
    expect(verdict({ kind: "low_air_warning", value: 60 })).toBe("at_limit");
  });
  it(`${LOW_AIR} — on only at 59.99 psi is beyond`, () => {
    expect(verdict({ kind: "low_air_warning", value: 59.99 })).toBe("beyond");
  });
  it(`${LOW_AIR} — on at 60.01 psi is within`, () => {
    expect(verdict({ kind: "low_air_warning", value: 60.01 })).toBe("within");
  });

  const SPRING = "spring brakes: “apply (parking knob pops out) between 20 and 45 psi”";
  it(`${SPRING} — exactly 20 psi, the low end, is allowed (at limit)`, () => {
    expect(verdict({ kind: "spring_brake_apply", value: 20 })).toBe("at_limit");
  });
  it(`${SPRING} — 19.99 psi is beyond; 20.01 psi within`, () => {
    expect(verdict({ kind: "spring_brake_apply", value: 19.99 })).toBe("beyond");
    expect(verdict({ kind: "spring_brake_apply", value: 20.01 })).toBe("within");
  });
  it(`${SPRING} — exactly 45 psi, the high end, is allowed (at limit)`, () => {
    expect(verdict({ kind: "spring_brake_apply", value: 45 })).toBe("at_limit");
  });
  it(`${SPRING} — 45.01 psi is beyond; 44.99 psi within`, () => {
    expect(verdict({ kind: "spring_brake_apply", value: 45.01 })).toBe("beyond");
    expect(verdict({ kind: "spring_brake_apply", value: 44.99 })).toBe("within");
  });

  const BUILDUP = "build-up: “dual air systems from 85 to 100 psi within 45 s”";
  it(`${BUILDUP} — exactly 45 s is allowed (at limit)`, () => {
    expect(verdict({ kind: "air_buildup", value: 45 })).toBe("at_limit");
  });
  it(`${BUILDUP} — 45.1 s is beyond (read to a tenth of a second)`, () => {
    expect(verdict({ kind: "air_buildup", value: 45.1 })).toBe("beyond");
  });
  it(`${BUILDUP} — 44.9 s is within`, () => {
    expect(verdict({ kind: "air_buildup", value: 44.9 })).toBe("within");
  });
});

describe("battery open-circuit voltage — common practice: BCI table at 80 °F, 75 % / 50 % bands ours", () => {
  const BANDS = "“12.45 V 75 % · 12.24 V 50 %” at 80 °F; at least 75 % within, 50 % up to 75 % at limit (caution band), below 50 % beyond";
  it(`${BANDS} — exactly 12.45 V (75 %) is within`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.45, temperature: 80 })).toBe("within");
  });
  it(`${BANDS} — 12.449 V, just under 75 %, is in the caution band (at limit)`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.449, temperature: 80 })).toBe("at_limit");
  });
  it(`${BANDS} — exactly 12.24 V (50 %) is still in the band (at limit)`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.24, temperature: 80 })).toBe("at_limit");
  });
  it(`${BANDS} — 12.239 V, under 50 %, is beyond`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.239, temperature: 80 })).toBe("beyond");
  });
  const COLD = "“a cold battery reads lower … add about 0.024 V per 10 °F that the battery is below 80 °F (and subtract above it)”";
  it(`${COLD} — 12.55 V at 60 °F reads as 12.598 V, about 93.5 % (reference-values.md's worked figure)`, () => {
    const r = checkReading({ kind: "battery_ocv", value: 12.55, temperature: 60 });
    expect(r.note).toContain("Corrected to 80 °F: 12.598 V");
    expect(r.derived?.value).toBe(93.5);
    expect(r.verdict).toBe("within");
  });
  it(`${COLD} — “a full one reads about 12.53 V at 30 °F”: corrected, 100 %`, () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.53, temperature: 30 }).derived?.value).toBe(100);
  });
  it(`${COLD} — edge at 60 °F: 12.402 V corrects to 12.45 V (within); 12.401 V is at limit`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.402, temperature: 60 })).toBe("within");
    expect(verdict({ kind: "battery_ocv", value: 12.401, temperature: 60 })).toBe("at_limit");
  });
  it(`${COLD} — edge at 60 °F: 12.192 V corrects to 12.24 V (at limit); 12.191 V is beyond`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.192, temperature: 60 })).toBe("at_limit");
    expect(verdict({ kind: "battery_ocv", value: 12.191, temperature: 60 })).toBe("beyond");
  });
  it(`${COLD} — above 80 °F it is subtracted: at 100 °F 12.498 V corrects to 12.45 V (within); 12.497 V at limit`, () => {
    expect(verdict({ kind: "battery_ocv", value: 12.498, temperature: 100 })).toBe("within");
    expect(verdict({ kind: "battery_ocv", value: 12.497, temperature: 100 })).toBe("at_limit");
  });
  it(`${COLD} — the verdict says which battery temperature it used`, () => {
    const r = checkReading({ kind: "battery_ocv", value: 12.4, temperature: 5, temperatureUnit: "C" });
    expect(r.limit).toContain("at 5 °C (41 °F)");
    expect(checkReading({ kind: "battery_ocv", value: 12.4 }).limit).toContain("80 °F assumed");
  });
});

describe("battery load test — common practice: half the CCA for 15 s, minimum volts by temperature", () => {
  const RULE = "“minimum voltage at the end by battery temperature … Between rows use the colder row's value”";
  it.each([
    [70, 9.6],
    [60, 9.5],
    [50, 9.4],
    [40, 9.3],
    [30, 9.1],
    [20, 8.9],
    [10, 8.7],
    [0, 8.5],
  ])(`${RULE} — at %d °F, exactly %d V is allowed (at limit)`, (fahrenheit, volts) => {
    expect(verdict({ kind: "battery_load_test", value: volts, temperature: fahrenheit })).toBe("at_limit");
  });
  it.each([
    [70, 9.6],
    [30, 9.1],
    [0, 8.5],
  ])(`${RULE} — at %d °F, 1 mV under %d V is beyond`, (fahrenheit, volts) => {
    expect(verdict({ kind: "battery_load_test", value: volts - 0.001, temperature: fahrenheit })).toBe("beyond");
  });
  it.each([
    [70, 9.6],
    [30, 9.1],
    [0, 8.5],
  ])(`${RULE} — at %d °F, 1 mV over %d V is within`, (fahrenheit, volts) => {
    expect(verdict({ kind: "battery_load_test", value: volts + 0.001, temperature: fahrenheit })).toBe("within");
  });
  it(`${RULE} — 69.99 °F takes the 60 °F row (9.5 V), 70 °F the 70 °F row (9.6 V)`, () => {
    expect(checkReading({ kind: "battery_load_test", value: 9.5, temperature: 69.99 })).toMatchObject({ verdict: "at_limit", limitValue: 9.5 });
    expect(checkReading({ kind: "battery_load_test", value: 9.5, temperature: 70 })).toMatchObject({ verdict: "beyond", limitValue: 9.6 });
  });
});

describe("cranking voltage — common practice: “often will not fire when cranking voltage falls to about 10–10.5 V”", () => {
  const RULE = "the 10–10.5 V no-start band is documented as a caution band";
  it(`${RULE} — exactly 10.5 V is in the band (at limit); 10.501 V within`, () => {
    expect(verdict({ kind: "cranking_voltage", value: 10.5 })).toBe("at_limit");
    expect(verdict({ kind: "cranking_voltage", value: 10.501 })).toBe("within");
  });
  it(`${RULE} — exactly 10 V is in the band (at limit); 9.999 V beyond`, () => {
    expect(verdict({ kind: "cranking_voltage", value: 10 })).toBe("at_limit");
    expect(verdict({ kind: "cranking_voltage", value: 9.999 })).toBe("beyond");
  });
});

describe("key-off drain — common practice: no universal published limit; a per-unit figure", () => {
  const RULE = "“default warning above 50 mA, ‘beyond’ above the unit's configured figure”";
  it(`${RULE} — exactly 50 mA is not above the warning: within (unit figure 120 mA)`, () => {
    expect(verdict({ kind: "key_off_drain", value: 50, unitLimitMa: 120 })).toBe("within");
  });
  it(`${RULE} — 50.01 mA is above the warning: at limit`, () => {
    expect(verdict({ kind: "key_off_drain", value: 50.01, unitLimitMa: 120 })).toBe("at_limit");
  });
  it(`${RULE} — exactly the unit's 120 mA is allowed: at limit`, () => {
    expect(verdict({ kind: "key_off_drain", value: 120, unitLimitMa: 120 })).toBe("at_limit");
  });
  it(`${RULE} — 120.01 mA, above the unit's figure, is beyond`, () => {
    expect(verdict({ kind: "key_off_drain", value: 120.01, unitLimitMa: 120 })).toBe("beyond");
  });
  it(`${RULE} — no figure set: the 50 mA default is the limit; exactly 50 mA at limit, 50.01 mA beyond, 49.99 mA within`, () => {
    expect(verdict({ kind: "key_off_drain", value: 50 })).toBe("at_limit");
    expect(verdict({ kind: "key_off_drain", value: 50.01 })).toBe("beyond");
    expect(verdict({ kind: "key_off_drain", value: 49.99 })).toBe("within");
  });
});

describe("annual inspection — published: 49 CFR 396.17 (30-day warning band is common practice)", () => {
  const PERIODIC = "396.17(c): “every component inspected at least once in the preceding 12 months”";
  const inspect = (lastInspection: string, today: string, basis: "periodic" | "state") =>
    verdict({ kind: "annual_inspection", lastInspection, today, basis });
  it(`${PERIODIC} — on the due date itself (12 months to the day) it still counts: at limit`, () => {
    expect(inspect("2025-03-14", "2026-03-14", "periodic")).toBe("at_limit");
  });
  it(`${PERIODIC} — the day after the due date is beyond`, () => {
    expect(inspect("2025-03-14", "2026-03-15", "periodic")).toBe("beyond");
  });
  it(`${PERIODIC} — warning band: 30 days left is at limit, 31 days left within`, () => {
    expect(inspect("2025-03-14", "2026-02-12", "periodic")).toBe("at_limit");
    expect(inspect("2025-03-14", "2026-02-11", "periodic")).toBe("within");
  });
  const STATE = "396.17(f): a state inspection “counts for 12 months from the last day of the month it was done in”";
  it(`${STATE} — done 14 Mar 2025: still counts on 31 Mar 2026 (at limit)`, () => {
    expect(inspect("2025-03-14", "2026-03-31", "state")).toBe("at_limit");
  });
  it(`${STATE} — done 14 Mar 2025: beyond on 1 Apr 2026`, () => {
    expect(inspect("2025-03-14", "2026-04-01", "state")).toBe("beyond");
  });
});
