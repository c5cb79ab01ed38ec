import { describe, expect, it } from "vitest";
import { AMMETER_CAUTION, DEFAULT_DRAIN_WARNING_MA, checkReading } from "@/lib/specs";
import type { KeyOffDrainInput } from "@/lib/specs";

const drain = (value: number, extra: Partial<KeyOffDrainInput> = {}) => checkReading({ kind: "key_off_drain", value, ...extra });

// Common practice (no universal published limit): warn above 50 mA by default;
// beyond above the unit's configured figure.
describe("key-off drain against the unit's figure (common practice)", () => {
  it("common practice: the default warning figure is 50 mA", () => {
    expect(DEFAULT_DRAIN_WARNING_MA).toBe(50);
  });

  it("common practice: 30 mA on a unit set to 300 mA is within, and the limit names the unit's figure", () => {
    const r = drain(30, { unitLimitMa: 300 });
    expect(r).toMatchObject({ verdict: "within", limitValue: 300, unit: "mA", sourceKind: "common_practice" });
    expect(r.limit).toBe("≤ 300 mA (this unit's figure, 300 mA); warning above 50 mA");
    expect(r.note).toContain("Limit used: this unit's figure, 300 mA.");
  });

  it("edge: exactly 50 mA is not above the warning figure → within", () => {
    expect(drain(50, { unitLimitMa: 300 }).verdict).toBe("within");
  });

  it("edge: 50.5 mA is above the 50 mA warning → at_limit", () => {
    expect(drain(50.5, { unitLimitMa: 300 }).verdict).toBe("at_limit");
  });

  it("edge: exactly the unit's 300 mA → at_limit; 301 mA → beyond", () => {
    expect(drain(300, { unitLimitMa: 300 }).verdict).toBe("at_limit");
    expect(drain(301, { unitLimitMa: 300 }).verdict).toBe("beyond");
  });

  it("with no unit figure, 50 mA serves as the limit too (cautious) and the note says to set one", () => {
    const r = drain(80);
    expect(r).toMatchObject({ verdict: "beyond", limitValue: 50 });
    expect(r.limit).toContain("no figure set for this unit, so the 50 mA default");
    expect(r.note).toMatch(/set this unit's figure/);
    expect(drain(50).verdict).toBe("at_limit");
    expect(drain(49).verdict).toBe("within");
  });

  it("a unit figure below the warning figure lowers the warning to it", () => {
    expect(drain(35, { unitLimitMa: 30 }).verdict).toBe("beyond");
    expect(drain(30, { unitLimitMa: 30 }).verdict).toBe("at_limit");
    expect(drain(29, { unitLimitMa: 30 }).verdict).toBe("within");
  });

  it("honours a changed warning figure", () => {
    expect(drain(80, { unitLimitMa: 300, warnAboveMa: 100 }).verdict).toBe("within");
    expect(drain(120, { unitLimitMa: 300, warnAboveMa: 100 }).verdict).toBe("at_limit");
  });

  it("common practice: always warns that an ammeter in series is usually limited to 10 A", () => {
    expect(AMMETER_CAUTION).toMatch(/10 A/);
    expect(drain(20, { unitLimitMa: 300 }).note).toContain(AMMETER_CAUTION);
  });

  it("common practice: warns when read before the modules sleep (often 45–75 min)", () => {
    expect(drain(20, { minutesAfterKeyOff: 10 }).note).toMatch(/only 10 min: modules may still be awake/);
    expect(drain(20, { minutesAfterKeyOff: 60 }).note).toMatch(/Read only after the modules have gone to sleep/);
  });
});
