import { strokeLimitFor, strokeToUnits } from "./brake-stroke";
import { ReadingInputError, requireNumber, verdictForMaximum } from "./exact";
import type { BrakeStrokeInput, SourceKind, Verdict } from "./types";

/**
 * Out-of-service rule of thumb — FROM MEMORY (roadside inspection criteria), not
 * confirmed in a text: a brake ¼ in or more over its readjustment limit counts
 * as one defective brake; 20 % or more of the service brakes defective puts the
 * vehicle out of service. A screen for the shop, never an inspector's decision.
 */
export const DEFECTIVE_OVER_LIMIT_IN = 0.25;
export const OUT_OF_SERVICE_SHARE_PERCENT = 20;

export interface BrakeStrokeCheck {
  verdict: Verdict;
  /** inches over the limit (negative: under it) */
  overByIn: number;
  defective: boolean;
}

export interface BrakeOutOfServiceSummary {
  totalServiceBrakes: number;
  brakes: BrakeStrokeCheck[];
  overLimit: number;
  defective: number;
  defectivePercent: number;
  outOfService: boolean;
  rule: string;
  source: string;
  sourceKind: SourceKind;
  note: string;
}

type StrokeEntry = Omit<BrakeStrokeInput, "kind"> & { kind?: "brake_stroke" };

/**
 * strokes: the measured service brakes. totalServiceBrakes: all service brakes on
 * the vehicle or combination, when some were not measured (defaults to strokes.length).
 */
export function brakeOutOfServiceSummary(
  strokes: readonly StrokeEntry[],
  totalServiceBrakes: number = strokes.length,
): BrakeOutOfServiceSummary {
  if (!Number.isSafeInteger(totalServiceBrakes) || totalServiceBrakes < strokes.length || totalServiceBrakes < 1) {
    throw new ReadingInputError("The number of service brakes must be a whole number, at least the strokes measured");
  }
  const defectiveMargin = strokeToUnits(DEFECTIVE_OVER_LIMIT_IN);
  const brakes = strokes.map((entry): BrakeStrokeCheck => {
    const valueUnits = strokeToUnits(requireNumber(entry.value, "Pushrod stroke", { min: 0 }));
    const limit = strokeLimitFor(entry);
    const over = valueUnits - limit.units;
    return {
      verdict: verdictForMaximum(valueUnits, limit.units),
      overByIn: over / 100_000,
      defective: over >= defectiveMargin,
    };
  });
  const overLimit = brakes.filter((b) => b.verdict === "beyond").length;
  const defective = brakes.filter((b) => b.defective).length;
  return {
    totalServiceBrakes,
    brakes,
    overLimit,
    defective,
    defectivePercent: Math.round((defective * 1000) / totalServiceBrakes) / 10,
    // 20 % or more, in whole numbers: defective × 100 ≥ 20 × total
    outOfService: defective * 100 >= OUT_OF_SERVICE_SHARE_PERCENT * totalServiceBrakes,
    rule: "A brake ¼ in or more over its limit counts as defective; 20 % or more of the service brakes defective puts the vehicle out of service.",
    source: "Roadside inspection out-of-service criteria (from memory, not confirmed in a text)",
    sourceKind: "from_memory",
    note: "A screen for the shop only: the inspector's criteria decide, and every brake over its limit needs adjustment or repair whatever this count says.",
  };
}
