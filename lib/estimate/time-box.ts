import { isApprovedState, type EstimateLine, type Refusal } from "./types";

export type TimeBoxStatus = "ok" | "warn" | "blocked";

export interface TimeBox {
  status: TimeBoxStatus;
  usedMilli: number;
  approvedMilli: number;
  /** Whole percent used, rounded down (so it reads 80 exactly when the warning starts). */
  percent: number;
}

export const TIME_BOX_WARN_PERCENT = 80;

/** Hours in thousandths as "1.5 h" / "0.25 h" for messages. */
export function formatHours(milli: number): string {
  const sign = milli < 0 ? "-" : "";
  const abs = Math.abs(milli);
  const fraction = String(abs % 1000).padStart(3, "0").replace(/0+$/, "");
  return `${sign}${Math.trunc(abs / 1000)}.${fraction.length === 0 ? "0" : fraction} h`;
}

/** Clocked seconds as thousandths of an hour (3.6 s each), rounded up so the box never under-counts. */
export function milliHoursFromSeconds(seconds: number): number {
  if (!Number.isSafeInteger(seconds) || seconds < 0) throw new RangeError(`seconds must be a whole number ≥ 0, got ${seconds}`);
  return Math.ceil((seconds * 10) / 36);
}

export function timeBox(usedMilli: number, approvedMilli: number): TimeBox {
  // Integer comparisons: used/approved ≥ 80 % ⇔ used × 100 ≥ approved × 80.
  const blocked = usedMilli >= approvedMilli;
  const warn = usedMilli * 100 >= approvedMilli * TIME_BOX_WARN_PERCENT;
  const percent = approvedMilli > 0 ? Math.floor((usedMilli * 100) / approvedMilli) : 100;
  return { status: blocked ? "blocked" : warn ? "warn" : "ok", usedMilli, approvedMilli, percent };
}

/** Hours the customer approved on a diagnosis line: none until the line is approved. */
export function approvedDiagnosisMilli(line: EstimateLine): number {
  return isApprovedState(line.state) ? line.quantityMilli : 0;
}

/** The box of a line, or null when the line is not a diagnosis line (no time box). */
export function timeBoxOf(line: EstimateLine, usedMilli: number): TimeBox | null {
  return line.isDiagnosis ? timeBox(usedMilli, approvedDiagnosisMilli(line)) : null;
}

export interface TimeEntryAmounts {
  usedMilli: number;
  addMilli: number;
  afterMilli: number;
  approvedMilli: number;
}

export type TimeEntryVerdict =
  | { ok: true; box: TimeBox | null }
  | Refusal<"time_box_exceeded" | "time_box_reached", TimeEntryAmounts>;

/**
 * Call before accepting a time entry on a line: refused when it would take a
 * diagnosis line past its approved hours (reaching exactly 100 % is allowed).
 * `box` is the box after the entry.
 */
export function checkTimeEntry(input: { line: EstimateLine; usedMilli: number; addMilli: number }): TimeEntryVerdict {
  const { line, usedMilli, addMilli } = input;
  const afterMilli = usedMilli + addMilli;
  if (!line.isDiagnosis) return { ok: true, box: null };
  const approvedMilli = approvedDiagnosisMilli(line);
  if (addMilli <= 0 || afterMilli <= approvedMilli) return { ok: true, box: timeBox(afterMilli, approvedMilli) };
  return {
    ok: false,
    code: "time_box_exceeded",
    detail:
      `adding ${formatHours(addMilli)} would bring diagnosis time to ${formatHours(afterMilli)}; ` +
      `the customer approved ${formatHours(approvedMilli)}, so the time box needs extending first`,
    amounts: { usedMilli, addMilli, afterMilli, approvedMilli },
  };
}

/** Call before a clock-in: refused once the approved diagnosis hours are used up. */
export function checkClockIn(input: { line: EstimateLine; usedMilli: number }): TimeEntryVerdict {
  const { line, usedMilli } = input;
  const box = timeBoxOf(line, usedMilli);
  if (box === null || box.status !== "blocked") return { ok: true, box };
  return {
    ok: false,
    code: "time_box_reached",
    detail:
      `diagnosis time is at ${formatHours(usedMilli)} of the ${formatHours(box.approvedMilli)} the customer approved; ` +
      `the time box needs extending before clocking in again`,
    amounts: { usedMilli, addMilli: 0, afterMilli: usedMilli, approvedMilli: box.approvedMilli },
  };
}
