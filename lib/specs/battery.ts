import { formatNumber, formatTemperature, requireNumber, toMilliFahrenheit, toUnits } from "./exact";
import type { BatteryLoadTestInput, BatteryOcvInput, CrankingVoltageInput, ReadingResult, Verdict } from "./types";

/** Open-circuit volts → state of charge at 80 °F, 12 V flooded lead-acid (BCI table as reprinted in battery technical notes). */
export const OCV_TABLE_80F: readonly { volts: number; percent: number }[] = [
  { volts: 12.65, percent: 100 },
  { volts: 12.45, percent: 75 },
  { volts: 12.24, percent: 50 },
  { volts: 12.06, percent: 25 },
  { volts: 11.89, percent: 0 },
];

/** Verdict thresholds (common practice, our choice): ≥ 75 % within, 50 % up to 75 % at_limit, below 50 % beyond. */
export const OCV_WITHIN_VOLTS_80F = 12.45;
export const OCV_AT_LIMIT_VOLTS_80F = 12.24;

/** 0.024 V per 10 °F = 2.4 µV per thousandth of a °F, measured from 80 °F. */
const REFERENCE_MILLI_F = 80_000;

/**
 * The correction, in µV, ADDED to a reading before the 80 °F table is used. A
 * cold battery reads lower at the same charge (a full one reads about 12.53 V
 * at 30 °F), so below 80 °F the reading is raised by about 0.024 V per 10 °F;
 * above 80 °F it is lowered by the same rate (reference-values.md, batteries;
 * the earlier wording there had the sign the wrong way round, and so did this).
 */
export function ocvCorrectionMicroVolts(milliF: number): number {
  return Math.round(((REFERENCE_MILLI_F - milliF) * 24) / 10);
}

const microVolts = (volts: number): number => toUnits(volts, 6);

/** State of charge (%, one decimal) for a voltage already corrected to 80 °F, by straight-line interpolation. */
export function stateOfChargePercent(correctedVolts: number): number {
  const v = microVolts(correctedVolts);
  const top = OCV_TABLE_80F[0];
  const bottom = OCV_TABLE_80F[OCV_TABLE_80F.length - 1];
  if (!top || !bottom) return 0;
  if (v >= microVolts(top.volts)) return top.percent;
  if (v <= microVolts(bottom.volts)) return bottom.percent;
  for (let i = 0; i + 1 < OCV_TABLE_80F.length; i += 1) {
    const hi = OCV_TABLE_80F[i];
    const lo = OCV_TABLE_80F[i + 1];
    if (!hi || !lo) break;
    const vHi = microVolts(hi.volts);
    const vLo = microVolts(lo.volts);
    if (v >= vLo && v <= vHi) {
      const tenths = lo.percent * 10 + ((v - vLo) * (hi.percent - lo.percent) * 10) / (vHi - vLo);
      return Math.round(tenths) / 10;
    }
  }
  return 0;
}

export function checkBatteryOcv(input: BatteryOcvInput): ReadingResult {
  const value = requireNumber(input.value, "Open-circuit voltage", { min: 0 });
  const unit = input.temperatureUnit ?? "F";
  const milliF = input.temperature === undefined ? REFERENCE_MILLI_F : toMilliFahrenheit(input.temperature, unit);
  const correction = ocvCorrectionMicroVolts(milliF);
  const corrected = microVolts(value) + correction;
  const verdict: Verdict =
    corrected >= microVolts(OCV_WITHIN_VOLTS_80F) ? "within"
      : corrected >= microVolts(OCV_AT_LIMIT_VOLTS_80F) ? "at_limit" : "beyond";
  // The same bands as raw readings at this temperature.
  const withinRaw = (microVolts(OCV_WITHIN_VOLTS_80F) - correction) / 1e6;
  const atLimitRaw = (microVolts(OCV_AT_LIMIT_VOLTS_80F) - correction) / 1e6;
  const where = input.temperature === undefined ? "80 °F assumed (no temperature entered)" : `at ${formatTemperature(input.temperature, unit)}`;
  return {
    kind: "battery_ocv", value, unit: "V", verdict,
    limit: `≥ ${formatNumber(withinRaw)} V ${where} = 75 % charged (${OCV_WITHIN_VOLTS_80F} V at 80 °F); below ${formatNumber(atLimitRaw)} V (50 %) is beyond`,
    limitValue: withinRaw,
    source: "BCI open-circuit voltage table at 80 °F, as reprinted in battery technical notes; 75 %/50 % verdict bands are common practice",
    sourceKind: "common_practice",
    note: `Corrected to 80 °F: ${formatNumber(corrected / 1e6)} V. Remove surface charge before reading. Charge and retest a battery below 75 %.`,
    derived: { label: "State of charge", value: stateOfChargePercent(corrected / 1e6), unit: "%" },
  };
}

/** Minimum volts at the end of 15 s at half the CCA rating, by battery temperature (°F, warmest first). */
export const LOAD_TEST_MINIMUMS: readonly { fahrenheit: number; volts: number }[] = [
  { fahrenheit: 70, volts: 9.6 },
  { fahrenheit: 60, volts: 9.5 },
  { fahrenheit: 50, volts: 9.4 },
  { fahrenheit: 40, volts: 9.3 },
  { fahrenheit: 30, volts: 9.1 },
  { fahrenheit: 20, volts: 8.9 },
  { fahrenheit: 10, volts: 8.7 },
  { fahrenheit: 0, volts: 8.5 },
];

/** Between rows the colder row's value is used (the "70 °F and above" row covers everything warmer). */
export function loadTestMinimum(milliF: number): { fahrenheit: number; volts: number; belowTable: boolean } {
  for (const row of LOAD_TEST_MINIMUMS) {
    if (milliF >= row.fahrenheit * 1000) return { ...row, belowTable: false };
  }
  return { fahrenheit: 0, volts: 8.5, belowTable: true };
}

export function checkBatteryLoadTest(input: BatteryLoadTestInput): ReadingResult {
  const value = requireNumber(input.value, "Voltage under load", { min: 0 });
  const unit = input.temperatureUnit ?? "F";
  const row = loadTestMinimum(toMilliFahrenheit(input.temperature, unit));
  const mv = toUnits(value, 3);
  const minMv = toUnits(row.volts, 3);
  const verdict: Verdict = mv > minMv ? "within" : mv === minMv ? "at_limit" : "beyond";
  const rowText = row.fahrenheit === 70 ? "70 °F and above" : `${row.fahrenheit} °F row`;
  const below = row.belowTable ? " The battery is colder than the table's coldest row (0 °F); its figure is used, and the result is less certain." : "";
  return {
    kind: "battery_load_test", value, unit: "V", verdict,
    limit: `≥ ${row.volts} V after 15 s at half CCA (battery at ${formatTemperature(input.temperature, unit)}: ${rowText})`,
    limitValue: row.volts,
    source: "Load-test minimum voltage table widely printed in service procedures (common practice)",
    sourceKind: "common_practice",
    note: `Between table rows the colder row's figure is used.${below} Wear eye protection; a battery under load can vent explosive gas.`,
  };
}

export const CRANKING_NO_START_VOLTS = { high: 10.5, low: 10 } as const;

export function checkCrankingVoltage(input: CrankingVoltageInput): ReadingResult {
  const value = requireNumber(input.value, "Cranking voltage", { min: 0 });
  const mv = toUnits(value, 3);
  const verdict: Verdict =
    mv > toUnits(CRANKING_NO_START_VOLTS.high, 3) ? "within"
      : mv >= toUnits(CRANKING_NO_START_VOLTS.low, 3) ? "at_limit" : "beyond";
  return {
    kind: "cranking_voltage", value, unit: "V", verdict,
    limit: `above ${CRANKING_NO_START_VOLTS.high} V while cranking (no-start risk at about ${CRANKING_NO_START_VOLTS.low}–${CRANKING_NO_START_VOLTS.high} V)`,
    limitValue: CRANKING_NO_START_VOLTS.high,
    source: "Common practice: electronically controlled injection often will not fire at about 10–10.5 V cranking",
    sourceKind: "common_practice",
    note: "A battery that passes at rest can still cause a no-start if cranking voltage sags; check cables and grounds too.",
  };
}
