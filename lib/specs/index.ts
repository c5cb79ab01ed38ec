import { checkAirBuildup, checkAirLeak, checkGovernor, checkLowAirWarning, checkSpringBrakeApply } from "./air-system";
import { checkBatteryLoadTest, checkBatteryOcv, checkCrankingVoltage } from "./battery";
import { checkBrakeStroke } from "./brake-stroke";
import { checkKeyOffDrain } from "./drain";
import { ReadingInputError } from "./exact";
import { checkAnnualInspection } from "./inspection";
import { checkTreadDepth } from "./tread";
import type { ReadingInput, ReadingResult, SourceKind } from "./types";

export * from "./types";
export { READING_KINDS } from "./reading-kinds";
export type { FieldSpec, ReadingKindMeta, SelectOption } from "./reading-kinds";
export { ReadingInputError, celsiusToFahrenheit, formatInches } from "./exact";
export { brakeOutOfServiceSummary } from "./brake-out-of-service";
export type { BrakeOutOfServiceSummary, BrakeStrokeCheck } from "./brake-out-of-service";
export { CLAMP_STROKE_LIMITS_IN, strokeLimitFor } from "./brake-stroke";
export { mmToThirtySeconds, thirtySecondsToMm, TREAD_MINIMUM_32NDS } from "./tread";
export { stateOfChargePercent, loadTestMinimum } from "./battery";
export { annualInspectionDueDate } from "./inspection";
export { AMMETER_CAUTION, DEFAULT_DRAIN_WARNING_MA } from "./drain";

const SOURCE_KIND_WORDS: Record<SourceKind, string> = {
  published: "published",
  common_practice: "common practice",
  from_memory: "from memory",
};

/** "Source (kind)", naming the kind once: many sources already say "common practice" in their own words. */
export function sourceLine(source: string, sourceKind: string): string {
  const words = SOURCE_KIND_WORDS[sourceKind as SourceKind];
  if (!words || source.toLowerCase().includes(words)) return source;
  return `${source} (${words})`;
}

/** The one-line caution every page showing a verdict carries. */
export const READING_CAUTION =
  "Readings support the technician's judgement; the maker's procedure, local codes and licensed inspectors decide.";

/** Checks one reading against its limit. Throws ReadingInputError when the input cannot be checked. */
export function checkReading(input: ReadingInput): ReadingResult {
  switch (input.kind) {
    case "tread_depth":
      return checkTreadDepth(input);
    case "brake_stroke":
      return checkBrakeStroke(input);
    case "air_leak":
      return checkAirLeak(input);
    case "governor_cut_in":
    case "governor_cut_out":
      return checkGovernor(input);
    case "low_air_warning":
      return checkLowAirWarning(input);
    case "spring_brake_apply":
      return checkSpringBrakeApply(input);
    case "air_buildup":
      return checkAirBuildup(input);
    case "battery_ocv":
      return checkBatteryOcv(input);
    case "battery_load_test":
      return checkBatteryLoadTest(input);
    case "cranking_voltage":
      return checkCrankingVoltage(input);
    case "key_off_drain":
      return checkKeyOffDrain(input);
    case "annual_inspection":
      return checkAnnualInspection(input);
    default: {
      const unknown: never = input;
      throw new ReadingInputError(`Unknown reading kind: ${String((unknown as { kind?: unknown }).kind)}`);
    }
  }
}

export type CheckOutcome = { ok: true; result: ReadingResult } | { ok: false; message: string };

/** checkReading as a result value, for forms: input problems come back as a message. */
export function tryCheckReading(input: ReadingInput): CheckOutcome {
  try {
    return { ok: true, result: checkReading(input) };
  } catch (error) {
    if (error instanceof ReadingInputError) return { ok: false, message: error.message };
    throw error;
  }
}
