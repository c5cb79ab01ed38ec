import { formatNumber, requireNumber, toUnits } from "./exact";
import type { KeyOffDrainInput, ReadingResult, Verdict } from "./types";

/**
 * Key-off drain has no universal published limit (common practice): light vehicles
 * are commonly expected under about 50 mA; heavy trucks with many modules may be
 * accepted by their makers at a few hundred mA. So the limit is a per-unit figure.
 */
export const DEFAULT_DRAIN_WARNING_MA = 50;
export const MODULE_SLEEP_MINUTES = { usual: 45, long: 75 } as const;

export const AMMETER_CAUTION =
  "An ammeter in series is usually limited to 10 A: do not crank or switch on heavy loads while it is connected.";

/**
 * within: at or below the warning figure; at_limit: above the warning figure up to
 * and including the unit's figure; beyond: above the unit's figure. With no figure
 * configured for the unit, the 50 mA warning figure is also used as the limit (the
 * cautious side), and the note says so.
 */
export function checkKeyOffDrain(input: KeyOffDrainInput): ReadingResult {
  const value = requireNumber(input.value, "Drain", { min: 0 });
  const configured = input.unitLimitMa !== undefined;
  const unitLimit = configured ? requireNumber(input.unitLimitMa ?? 0, "Unit's drain figure", { min: 0 }) : DEFAULT_DRAIN_WARNING_MA;
  const warnSetting = input.warnAboveMa === undefined ? DEFAULT_DRAIN_WARNING_MA : requireNumber(input.warnAboveMa, "Warning figure", { min: 0 });
  const warnAt = Math.min(warnSetting, unitLimit);

  const reading = toUnits(value, 2);
  const limitUnits = toUnits(unitLimit, 2);
  const verdict: Verdict =
    reading > limitUnits ? "beyond"
      : reading === limitUnits || reading > toUnits(warnAt, 2) ? "at_limit" : "within";

  const figure = configured
    ? `this unit's figure, ${formatNumber(unitLimit, 2)} mA`
    : `no figure set for this unit, so the ${DEFAULT_DRAIN_WARNING_MA} mA default`;
  const limit = warnAt < unitLimit
    ? `≤ ${formatNumber(unitLimit, 2)} mA (${figure}); warning above ${formatNumber(warnAt, 2)} mA`
    : `≤ ${formatNumber(unitLimit, 2)} mA (${figure})`;

  const parts = [`Limit used: ${figure}.`];
  if (!configured) {
    parts.push("Heavy trucks with many modules may be accepted by their makers at a few hundred mA: set this unit's figure for a firm verdict.");
  }
  if (input.minutesAfterKeyOff !== undefined && input.minutesAfterKeyOff < MODULE_SLEEP_MINUTES.usual) {
    parts.push(`Read after only ${formatNumber(input.minutesAfterKeyOff, 0)} min: modules may still be awake (they often take ${MODULE_SLEEP_MINUTES.usual}–${MODULE_SLEEP_MINUTES.long} min).`);
  } else {
    parts.push(`Read only after the modules have gone to sleep (often ${MODULE_SLEEP_MINUTES.usual}–${MODULE_SLEEP_MINUTES.long} min).`);
  }
  parts.push(AMMETER_CAUTION);

  return {
    kind: "key_off_drain", value, unit: "mA", verdict, limit, limitValue: unitLimit,
    source: configured ? "Unit's configured key-off drain figure (common practice: no universal published limit)" : "Common practice: about 50 mA default; no universal published limit",
    sourceKind: "common_practice",
    note: parts.join(" "),
  };
}
