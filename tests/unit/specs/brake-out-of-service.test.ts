import { describe, expect, it } from "vitest";
import { brakeOutOfServiceSummary } from "@/lib/specs";
import type { BrakeStrokeInput } from "@/lib/specs";

type Entry = Omit<BrakeStrokeInput, "kind">;
const type30 = (value: number): Entry => ({ chamberType: 30, strokeClass: "standard", value });
const goodBrakes = (n: number): Entry[] => Array.from({ length: n }, () => type30(1.5));

// Rule of thumb from memory (roadside inspection criteria), not confirmed in a text:
// a brake ¼ in or more over its limit is one defective brake; 20 % or more defective → out of service.
describe("brake out-of-service rule of thumb (from memory: ¼ in over = defective; 20 % or more = out of service)", () => {
  it("is marked from_memory", () => {
    const s = brakeOutOfServiceSummary(goodBrakes(10));
    expect(s.sourceKind).toBe("from_memory");
    expect(s.source).toMatch(/from memory/);
    expect(s).toMatchObject({ totalServiceBrakes: 10, overLimit: 0, defective: 0, outOfService: false });
  });

  it("from memory, edge: a type 30 brake exactly ¼ in over its 2 in limit (2¼ in) counts as defective", () => {
    const s = brakeOutOfServiceSummary([type30(2.25), ...goodBrakes(9)]);
    expect(s.defective).toBe(1);
    expect(s.brakes[0]).toMatchObject({ verdict: "beyond", defective: true });
    expect(s.brakes[0]?.overByIn).toBeCloseTo(0.25, 10);
  });

  it("from memory, edge: 0.2499 in over is over the limit but not counted defective", () => {
    const s = brakeOutOfServiceSummary([type30(2.2499), ...goodBrakes(9)]);
    expect(s).toMatchObject({ overLimit: 1, defective: 0, outOfService: false });
  });

  it("from memory: 1 defective of 10 (10 %) is not out of service", () => {
    const s = brakeOutOfServiceSummary([type30(2.5), ...goodBrakes(9)]);
    expect(s).toMatchObject({ defective: 1, defectivePercent: 10, outOfService: false });
  });

  it("from memory, edge: 2 defective of 10 is exactly 20 % → out of service", () => {
    const s = brakeOutOfServiceSummary([type30(2.25), type30(2.5), ...goodBrakes(8)]);
    expect(s).toMatchObject({ defective: 2, defectivePercent: 20, outOfService: true });
  });

  it("counts against all service brakes when some were not measured", () => {
    const measured = [type30(2.5), ...goodBrakes(4)];
    expect(brakeOutOfServiceSummary(measured).outOfService).toBe(true); // 1 of 5 = 20 %
    const s = brakeOutOfServiceSummary(measured, 6); // 1 of 6 ≈ 16.7 %
    expect(s.outOfService).toBe(false);
    expect(s.defectivePercent).toBeCloseTo(16.7, 5);
  });

  it("uses each brake's own limit (mixed chambers)", () => {
    const s = brakeOutOfServiceSummary([
      { chamberType: 20, strokeClass: "standard", value: 2 }, // 1¾ limit, ¼ over → defective
      { chamberType: 30, strokeClass: "long_stroke", value: 2.5 }, // at its limit
      ...goodBrakes(3),
    ]);
    expect(s.brakes.map((b) => b.verdict)).toEqual(["beyond", "at_limit", "within", "within", "within"]);
    expect(s).toMatchObject({ defective: 1, outOfService: true });
  });

  it("refuses a brake count smaller than the strokes given", () => {
    expect(() => brakeOutOfServiceSummary(goodBrakes(4), 3)).toThrow(/service brakes/);
    expect(() => brakeOutOfServiceSummary([])).toThrow(/service brakes/);
  });
});
