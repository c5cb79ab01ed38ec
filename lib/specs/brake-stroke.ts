import { ReadingInputError, formatInches, requireNumber, toUnits, verdictForMaximum } from "./exact";
import { CLAMP_CHAMBER_TYPES } from "./types";
import type { BrakeStrokeInput, ClampChamberType, ReadingResult, StrokeClass } from "./types";

/**
 * Clamp-type chamber readjustment limits, inches, 49 CFR 393.47(e)(1).
 * Wording confirmed against a stored eCFR copy: "(1) The pushrod stroke must not
 * be greater than the values specified in the following tables", and Part 396
 * Appendix A 1.a(5): "Any brake stroke exceeding the readjustment limit will be
 * rejected" — so a stroke exactly at the limit passes (at_limit).
 * The rows themselves could not be read in that copy (the tables did not come
 * through): they are as reprinted in reference-values.md, NOT confirmed.
 */
export const CLAMP_STROKE_LIMITS_IN: Readonly<Record<ClampChamberType, Partial<Record<StrokeClass, number>>>> = {
  6: { standard: 1.25 },
  9: { standard: 1.375 },
  12: { standard: 1.375, long_stroke: 1.75 },
  16: { standard: 1.75, long_stroke: 2 },
  20: { standard: 1.75, long_stroke: 2, long_stroke_3in: 2.5 },
  24: { standard: 1.75, long_stroke: 2, long_stroke_3in: 2.5 },
  30: { standard: 2, long_stroke: 2.5 },
  36: { standard: 2.25 },
};

/** Strokes are compared in whole 1/100 000 in: entries to 1/10 000 in, 80 % of a rated stroke exactly. */
const UNITS_PER_INCH = 100_000;

export function strokeToUnits(inches: number): number {
  return toUnits(inches, 4) * 10;
}

export interface StrokeLimit {
  /** whole 1/100 000 in */
  units: number;
  inches: number;
  text: string;
  source: string;
}

const CLASS_LABEL: Record<StrokeClass, string> = {
  standard: "standard stroke",
  long_stroke: "long-stroke",
  long_stroke_3in: "long-stroke, 3 in rated stroke",
};

function isClampType(value: unknown): value is ClampChamberType {
  return (CLAMP_CHAMBER_TYPES as readonly unknown[]).includes(value);
}

export function strokeLimitFor(input: Omit<BrakeStrokeInput, "kind" | "value">): StrokeLimit {
  const label = CLASS_LABEL[input.strokeClass];
  if (label === undefined) throw new ReadingInputError("Stroke class must be standard, long-stroke or long-stroke 3 in");
  if (input.chamberType !== "other" && !isClampType(input.chamberType)) {
    throw new ReadingInputError(`Chamber type must be one of ${CLAMP_CHAMBER_TYPES.join(", ")} or other`);
  }
  const row = input.chamberType === "other" ? undefined : CLAMP_STROKE_LIMITS_IN[input.chamberType][input.strokeClass];
  if (row !== undefined) {
    return {
      units: strokeToUnits(row),
      inches: row,
      text: `≤ ${formatInches(row)} in (type ${input.chamberType}, ${label})`,
      source: "49 CFR 393.47(e)(1)",
    };
  }
  // Not in the table: the marked limit, or 80 % of the marked rated stroke (393.47(e)(2)).
  const what = input.chamberType === "other" ? "This actuator is" : `Type ${input.chamberType} ${label} is`;
  if (input.markedLimitIn !== undefined) {
    const marked = requireNumber(input.markedLimitIn, "Marked readjustment limit", { min: 0 });
    return {
      units: strokeToUnits(marked),
      inches: marked,
      text: `≤ ${formatInches(marked)} in (limit marked on the actuator)`,
      source: "49 CFR 393.47(e)(2)",
    };
  }
  if (input.ratedStrokeIn !== undefined) {
    const rated = requireNumber(input.ratedStrokeIn, "Rated stroke", { min: 0 });
    const units = toUnits(rated, 4) * 8; // × 10 to 1/100 000 in, × 0.8
    const inches = units / UNITS_PER_INCH;
    return {
      units,
      inches,
      text: `≤ ${formatInches(inches)} in (80 % of the ${formatInches(rated)} in rated stroke)`,
      source: "49 CFR 393.47(e)(2)",
    };
  }
  throw new ReadingInputError(
    `${what} not in the 49 CFR 393.47(e)(1) table: enter the readjustment limit or the rated stroke marked on the actuator.`,
  );
}

const STROKE_NOTE =
  "Measure with the engine off, 80–90 psi in the reservoir and the brakes fully applied (49 CFR Part 396 Appendix A, 1.a(5)). Treat a chamber with no long-stroke marking as standard stroke (common practice).";

export function checkBrakeStroke(input: BrakeStrokeInput): ReadingResult {
  const value = requireNumber(input.value, "Pushrod stroke", { min: 0 });
  const limit = strokeLimitFor(input);
  const valueUnits = strokeToUnits(value);
  return {
    kind: "brake_stroke",
    value,
    unit: "in",
    verdict: verdictForMaximum(valueUnits, limit.units),
    limit: limit.text,
    limitValue: limit.inches,
    source: limit.source,
    sourceKind: "published",
    note: STROKE_NOTE,
    derived: { label: "Margin to the limit", value: (limit.units - valueUnits) / UNITS_PER_INCH, unit: "in" },
  };
}
