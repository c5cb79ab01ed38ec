import { ReadingInputError, formatNumber, requireNumber, toUnits, verdictForLessThan, verdictForMaximum, verdictForMinimum } from "./exact";
import type {
  AirBuildupInput,
  AirLeakInput,
  GovernorInput,
  LowAirWarningInput,
  ReadingResult,
  SpringBrakeApplyInput,
  Verdict,
} from "./types";

/** The commercial driver's licence manual, air brakes section ("final air brake check"). */
export const CDL_AIR_BRAKES_SOURCE = "CDL manual, air brakes section (final air brake check)";

/** psi lost per minute, engine off (CDL manual, air brakes section). */
export const AIR_LEAK_LIMITS_PSI_PER_MIN = {
  released: { single: 2, combination: 3 },
  applied: { single: 3, combination: 4 },
} as const;

export const LOW_AIR_WARNING_MIN_PSI = 60;
export const SPRING_BRAKE_RANGE_PSI = { low: 20, high: 45 } as const;
export const BUILDUP_MAX_SECONDS = 45;

/** About 100 / 125 psi per the CDL manual; the maker's figures govern. */
export const GOVERNOR_NOMINAL_PSI = { governor_cut_in: 100, governor_cut_out: 125 } as const;
/**
 * Our tolerance (common practice, not published): within ±5 psi of the figure,
 * at_limit from ±5 to ±10 psi ("check against the maker's figure"), beyond past ±10.
 */
export const GOVERNOR_TOLERANCE_PSI = { within: 5, atLimit: 10 } as const;

const psi = (value: number): number => toUnits(value, 2);

export function checkAirLeak(input: AirLeakInput): ReadingResult {
  const value = requireNumber(input.value, "Pressure loss", { min: 0 });
  const byState = AIR_LEAK_LIMITS_PSI_PER_MIN[input.brakes];
  const limitValue = byState?.[input.vehicle];
  if (limitValue === undefined) throw new ReadingInputError("Choose brakes released or applied, single or combination");
  const who = input.vehicle === "single" ? "single vehicle" : "combination";
  // Released: "less than 2 psi/min", so exactly 2 is a figure that must not be reached (beyond).
  // Applied: "more than 3 psi/min … is too much", so exactly 3 is allowed (at_limit).
  const verdict =
    input.brakes === "released" ? verdictForLessThan(psi(value), psi(limitValue)) : verdictForMaximum(psi(value), psi(limitValue));
  const limit =
    input.brakes === "released"
      ? `less than ${limitValue} psi/min (${who}, brakes released, engine off)`
      : `not more than ${limitValue} psi/min (${who}, brakes applied at 90 psi or more, engine off)`;
  return {
    kind: "air_leak", value, unit: "psi/min", verdict,
    limit, limitValue, source: CDL_AIR_BRAKES_SOURCE, sourceKind: "published",
    note: "Let the system settle before timing one minute; listen for leaks at fittings, chambers and valves.",
  };
}

export function checkGovernor(input: GovernorInput): ReadingResult {
  const value = requireNumber(input.value, "Governor pressure", { min: 0 });
  const nominal = GOVERNOR_NOMINAL_PSI[input.kind];
  const figure = input.specPsi === undefined ? nominal : requireNumber(input.specPsi, "Specified pressure", { min: 0 });
  const distance = Math.abs(psi(value) - psi(figure));
  const verdict: Verdict =
    distance <= psi(GOVERNOR_TOLERANCE_PSI.within) ? "within"
      : distance <= psi(GOVERNOR_TOLERANCE_PSI.atLimit) ? "at_limit" : "beyond";
  const which = input.kind === "governor_cut_in" ? "Cut-in" : "Cut-out";
  const basis = input.specPsi === undefined ? "usual figure" : "figure specified for this unit";
  return {
    kind: input.kind, value, unit: "psi", verdict,
    limit: `about ${formatNumber(figure)} psi (${basis}), ±${GOVERNOR_TOLERANCE_PSI.within} psi`,
    limitValue: figure,
    source: `${CDL_AIR_BRAKES_SOURCE}: ${which.toLowerCase()} about ${nominal} psi; the ±5/±10 psi band is ours`,
    sourceKind: "common_practice",
    note: `${which} pressure: the maker's figure governs. Within ±5 psi of the figure reads "within", ±5–10 psi "at limit" (check against the maker's figure), further off "beyond".`,
  };
}

export function checkLowAirWarning(input: LowAirWarningInput): ReadingResult {
  const value = requireNumber(input.value, "Warning pressure", { min: 0 });
  return {
    kind: "low_air_warning", value, unit: "psi",
    verdict: verdictForMinimum(psi(value), psi(LOW_AIR_WARNING_MIN_PSI)),
    limit: `on at ${LOW_AIR_WARNING_MIN_PSI} psi or above (before the tank falls below ${LOW_AIR_WARNING_MIN_PSI} psi)`,
    limitValue: LOW_AIR_WARNING_MIN_PSI, source: CDL_AIR_BRAKES_SOURCE, sourceKind: "published",
    note: "Read the tank with the lowest pressure in a dual air system.",
  };
}

export function checkSpringBrakeApply(input: SpringBrakeApplyInput): ReadingResult {
  const value = requireNumber(input.value, "Pop-out pressure", { min: 0 });
  const { low, high } = SPRING_BRAKE_RANGE_PSI;
  const reading = psi(value);
  const verdict: Verdict =
    reading === psi(low) || reading === psi(high) ? "at_limit"
      : reading > psi(low) && reading < psi(high) ? "within" : "beyond";
  return {
    kind: "spring_brake_apply", value, unit: "psi", verdict,
    limit: `between ${low} and ${high} psi`,
    limitValue: reading * 2 < psi(low + high) ? low : high,
    source: CDL_AIR_BRAKES_SOURCE, sourceKind: "published",
    note: "The manual gives 20–45 psi as the usual range; the maker's figure governs. Chock the wheels first.",
  };
}

export function checkAirBuildup(input: AirBuildupInput): ReadingResult {
  const value = requireNumber(input.value, "Build-up time", { min: 0 });
  return {
    kind: "air_buildup", value, unit: "s",
    verdict: verdictForMaximum(toUnits(value, 1), toUnits(BUILDUP_MAX_SECONDS, 1)),
    limit: `85 → 100 psi within ${BUILDUP_MAX_SECONDS} s (dual air system, operating rpm)`,
    limitValue: BUILDUP_MAX_SECONDS, source: CDL_AIR_BRAKES_SOURCE, sourceKind: "published",
    note: "Larger than minimum air tanks may take longer and still be safe: check the maker's figure.",
  };
}
