import type { MeterKind } from "./domain";
import { formatNumber } from "./format";

export const METER_UNITS: Record<MeterKind, string> = { odometer: "mi", engine_hours: "h" };
export const METER_LABELS: Record<MeterKind, string> = { odometer: "Odometer", engine_hours: "Engine hours" };

export type MeterCheck = { ok: true } | { ok: false; message: string };

/**
 * Meters only go up. A lower reading is either a typing mistake or a replaced
 * meter (instrument cluster, ECM); only the second is accepted, and only when
 * it is marked as such so the history explains the drop.
 */
export function checkMeterReading(
  kind: MeterKind,
  previous: { value: number; readAt: string } | null,
  next: { value: number; meterReplaced: boolean },
): MeterCheck {
  if (!Number.isFinite(next.value) || next.value < 0) return { ok: false, message: "A reading cannot be negative." };
  if (!previous || next.meterReplaced || next.value >= previous.value) return { ok: true };
  const unit = METER_UNITS[kind];
  return {
    ok: false,
    message: `${METER_LABELS[kind]} ${fmt(next.value)} ${unit} is lower than the last reading, ${fmt(previous.value)} ${unit}. If the meter was replaced, mark the reading as a meter change.`,
  };
}

function fmt(value: number): string {
  return formatNumber(value, 1);
}
