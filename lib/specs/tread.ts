import { ReadingInputError, formatNumber, requireNumber, toUnits, verdictForMinimum } from "./exact";
import type { ReadingResult, TreadDepthInput } from "./types";

/** Minimum depth in a major tread groove, in 32nds of an inch (49 CFR 393.75(b), (c)). */
export const TREAD_MINIMUM_32NDS = { steer: 4, other: 2 } as const;

export function thirtySecondsToMm(thirtySeconds: number): number {
  return (thirtySeconds * 79_375) / 100_000;
}

export function mmToThirtySeconds(mm: number): number {
  return (mm * 32) / 25.4;
}

const TREAD_NOTE =
  "Measure in a major tread groove, not on a tie bar, hump or fillet (49 CFR 393.75).";

export function checkTreadDepth(input: TreadDepthInput): ReadingResult {
  const value = requireNumber(input.value, "Tread depth", { min: 0 });
  const minimum = TREAD_MINIMUM_32NDS[input.position];
  if (minimum === undefined) throw new ReadingInputError("Axle position must be steer or other");
  const source = input.position === "steer" ? "49 CFR 393.75(b)" : "49 CFR 393.75(c)";
  const where = input.position === "steer" ? "front (steering) axle" : "all other tyres";
  const minimumMm = thirtySecondsToMm(minimum);
  const limit = `≥ ${minimum}/32 in (${formatNumber(minimumMm, 4)} mm), ${where}`;

  if (input.unit === "mm") {
    // Compare tenths of a micrometre × 32 with the limit × 254 000: exact, no division
    // (2/32 in is 1.5875 mm, so whole micrometres would not do).
    const verdict = verdictForMinimum(toUnits(value, 4) * 32, minimum * 254_000);
    return {
      kind: "tread_depth", value, unit: "mm", verdict, limit, limitValue: minimumMm, source,
      sourceKind: "published", note: TREAD_NOTE,
      derived: { label: "In 32nds of an inch", value: Math.round(mmToThirtySeconds(value) * 100) / 100, unit: "/32 in" },
    };
  }
  if (input.unit !== "32nds") throw new ReadingInputError("Tread depth unit must be 32nds or mm");
  const verdict = verdictForMinimum(toUnits(value, 2), minimum * 100);
  return {
    kind: "tread_depth", value, unit: "/32 in", verdict, limit, limitValue: minimum, source,
    sourceKind: "published", note: TREAD_NOTE,
    derived: { label: "In millimetres", value: Math.round(thirtySecondsToMm(value) * 1000) / 1000, unit: "mm" },
  };
}
