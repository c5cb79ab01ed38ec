import { ReadingInputError } from "./exact";
import type { AnnualInspectionInput, InspectionBasis, ReadingResult, Verdict } from "./types";

/** Warn this many days before the due date (common practice, our choice). */
export const INSPECTION_WARNING_DAYS = 30;

interface CivilDate {
  year: number;
  month: number; // 1–12
  day: number;
}

function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

export function parseIsoDate(text: string, what = "Date"): CivilDate {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!match) throw new ReadingInputError(`${what} must be written YYYY-MM-DD`);
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (year < 1900 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
    throw new ReadingInputError(`${what} ${text} is not a calendar date`);
  }
  return { year, month, day };
}

function formatIsoDate({ year, month, day }: CivilDate): string {
  return `${year}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
}

/** Whole days since 1970-01-01 (UTC arithmetic on the calendar date only; no clock is read). */
function dayNumber({ year, month, day }: CivilDate): number {
  return Date.UTC(year, month - 1, day) / 86_400_000;
}

/**
 * periodic (49 CFR 396.17(c)): 12 months from the day inspected (29 Feb → 28 Feb).
 * state (49 CFR 396.17(f)): 12 months from the last day of the month inspected.
 * The unit counts as inspected through the due date itself.
 */
export function annualInspectionDueDate(lastInspection: string, basis: InspectionBasis): string {
  const last = parseIsoDate(lastInspection, "Last inspection");
  const year = last.year + 1;
  const end = daysInMonth(year, last.month);
  const day = basis === "state" ? end : Math.min(last.day, end);
  return formatIsoDate({ year, month: last.month, day });
}

export function daysBetween(fromIso: string, toIso: string): number {
  return dayNumber(parseIsoDate(toIso)) - dayNumber(parseIsoDate(fromIso));
}

export function checkAnnualInspection(input: AnnualInspectionInput): ReadingResult {
  if (input.basis !== "periodic" && input.basis !== "state") {
    throw new ReadingInputError("Inspection basis must be periodic or state");
  }
  const today = parseIsoDate(input.today, "Today");
  if (dayNumber(today) < dayNumber(parseIsoDate(input.lastInspection, "Last inspection"))) {
    throw new ReadingInputError("The last inspection cannot be later than today");
  }
  const due = annualInspectionDueDate(input.lastInspection, input.basis);
  const daysLeft = dayNumber(parseIsoDate(due)) - dayNumber(today);
  const verdict: Verdict = daysLeft > INSPECTION_WARNING_DAYS ? "within" : daysLeft >= 0 ? "at_limit" : "beyond";
  const counted = input.basis === "state"
    ? "12 months from the last day of the month of the state inspection"
    : "12 months from the last periodic inspection";
  const status = daysLeft < 0 ? `${-daysLeft} days past due` : daysLeft === 0 ? "due today" : `${daysLeft} days left`;
  return {
    kind: "annual_inspection",
    value: daysLeft,
    unit: "days",
    verdict,
    limit: `due ${due} (${counted})`,
    limitValue: 0,
    source: input.basis === "state" ? "49 CFR 396.17(f)" : "49 CFR 396.17(c)",
    sourceKind: "published",
    note: `${status}. The ${INSPECTION_WARNING_DAYS}-day warning before the due date is common practice, not part of the regulation.`,
  };
}
