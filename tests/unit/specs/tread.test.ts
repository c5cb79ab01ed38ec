import { describe, expect, it } from "vitest";
import { checkReading, mmToThirtySeconds, thirtySecondsToMm, TREAD_MINIMUM_32NDS } from "@/lib/specs";
import type { AxlePosition, TreadUnit } from "@/lib/specs";

const tread = (position: AxlePosition, value: number, unit: TreadUnit = "32nds") =>
  checkReading({ kind: "tread_depth", position, value, unit });

describe("tread depth, steering axle — 49 CFR 393.75(b): at least 4/32 in", () => {
  it("49 CFR 393.75(b): the minimum is 4/32 in, published", () => {
    expect(TREAD_MINIMUM_32NDS.steer).toBe(4);
    const r = tread("steer", 6);
    expect(r).toMatchObject({ verdict: "within", limitValue: 4, unit: "/32 in", source: "49 CFR 393.75(b)", sourceKind: "published" });
    expect(r.limit).toContain("4/32 in");
  });

  it("49 CFR 393.75(b) edge: exactly 4/32 is allowed (at_limit)", () => {
    expect(tread("steer", 4).verdict).toBe("at_limit");
  });

  it("49 CFR 393.75(b) edge: just under (3.99/32) is beyond", () => {
    expect(tread("steer", 3.99).verdict).toBe("beyond");
  });

  it("49 CFR 393.75(b) edge: just over (4.01/32) is within", () => {
    expect(tread("steer", 4.01).verdict).toBe("within");
  });

  it("49 CFR 393.75(b): 3/32 on a steer tyre is beyond though it would pass on another axle", () => {
    expect(tread("steer", 3).verdict).toBe("beyond");
    expect(tread("other", 3).verdict).toBe("within");
  });
});

describe("tread depth, other tyres — 49 CFR 393.75(c): at least 2/32 in", () => {
  it("49 CFR 393.75(c): the minimum is 2/32 in, published", () => {
    expect(TREAD_MINIMUM_32NDS.other).toBe(2);
    expect(tread("other", 8)).toMatchObject({ verdict: "within", limitValue: 2, source: "49 CFR 393.75(c)", sourceKind: "published" });
  });

  it("49 CFR 393.75(c) edge: exactly 2/32 is at_limit", () => {
    expect(tread("other", 2).verdict).toBe("at_limit");
  });

  it("49 CFR 393.75(c) edge: just under (1.99/32) is beyond", () => {
    expect(tread("other", 1.99).verdict).toBe("beyond");
  });

  it("says where to measure (not on tie bars, humps or fillets, 49 CFR 393.75)", () => {
    expect(tread("other", 5).note).toMatch(/tie bar, hump or fillet/);
  });
});

describe("tread depth in millimetres (1 in = 25.4 mm exactly, so 1/32 in = 0.79375 mm)", () => {
  it("converts 1/32 in to 0.79375 mm and 25.4 mm to 32/32", () => {
    expect(thirtySecondsToMm(1)).toBeCloseTo(0.79375, 12);
    expect(thirtySecondsToMm(4)).toBeCloseTo(3.175, 12);
    expect(thirtySecondsToMm(2)).toBeCloseTo(1.5875, 12);
    expect(mmToThirtySeconds(25.4)).toBeCloseTo(32, 10);
    expect(mmToThirtySeconds(3.175)).toBeCloseTo(4, 10);
  });

  it("49 CFR 393.75(b) edge in mm: 3.175 mm on a steer tyre is exactly 4/32 in → at_limit", () => {
    const r = tread("steer", 3.175, "mm");
    expect(r).toMatchObject({ verdict: "at_limit", unit: "mm" });
    expect(r.limitValue).toBeCloseTo(3.175, 12);
    expect(r.derived?.value).toBeCloseTo(4, 2);
  });

  it("49 CFR 393.75(b) edge in mm: 3.1749 mm is beyond, 3.1751 mm within", () => {
    expect(tread("steer", 3.1749, "mm").verdict).toBe("beyond");
    expect(tread("steer", 3.1751, "mm").verdict).toBe("within");
  });

  it("49 CFR 393.75(c) edge in mm: 1.5875 mm is exactly 2/32 in → at_limit; 1.5 mm beyond", () => {
    expect(tread("other", 1.5875, "mm").verdict).toBe("at_limit");
    expect(tread("other", 1.5, "mm").verdict).toBe("beyond");
  });

  it("a 32nds reading also reports its millimetres", () => {
    const r = tread("other", 10);
    expect(r.derived).toEqual({ label: "In millimetres", value: 7.938, unit: "mm" });
  });
});

describe("tread depth input problems", () => {
  it("refuses a negative or non-numeric depth", () => {
    expect(() => tread("steer", -1)).toThrow(/cannot be below 0/);
    expect(() => tread("steer", Number.NaN)).toThrow(/must be a number/);
  });
});
