import type { FiscalYear } from "./types";

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})/;

function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

function pad(n: number, width: number): string {
  return String(n).padStart(width, "0");
}

function isoDate(year: number, month: number, day: number): string {
  return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
}

/** Reads the calendar date at the start of an ISO string ("2026-12-01" or "2026-12-01T09:30:00Z"). */
export function parseIsoDate(text: string): { year: number; month: number; day: number } {
  const match = ISO_DATE.exec(text);
  const [, y, m, d] = match ?? [];
  if (y === undefined || m === undefined || d === undefined) throw new RangeError(`not an ISO date: ${text}`);
  const year = Number(y);
  const month = Number(m);
  const day = Number(d);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
    throw new RangeError(`not a calendar date: ${text}`);
  }
  return { year, month, day };
}

function fiscalLabel(startYear: number, startMonth: number): string {
  if (startMonth === 1) return `FY ${startYear}`;
  const endYear = startYear + 1;
  const sameCentury = Math.floor(startYear / 100) === Math.floor(endYear / 100);
  return `FY ${startYear}–${sameCentury ? pad(endYear % 100, 2) : String(endYear)}`;
}

/**
 * The fiscal year holding a date, for a year that starts on the first day of
 * `startMonth`. Pure: the caller passes today's date (the shop's calendar date).
 */
export function fiscalYearOf(date: string, startMonth: number): FiscalYear {
  if (!Number.isInteger(startMonth) || startMonth < 1 || startMonth > 12) {
    throw new RangeError(`fiscal year start month must be 1..12, got ${startMonth}`);
  }
  const { year, month } = parseIsoDate(date);
  const startYear = month >= startMonth ? year : year - 1;
  const endMonth = startMonth === 1 ? 12 : startMonth - 1;
  const endYear = startMonth === 1 ? startYear : startYear + 1;
  return {
    startDate: isoDate(startYear, startMonth, 1),
    endDate: isoDate(endYear, endMonth, daysInMonth(endYear, endMonth)),
    label: fiscalLabel(startYear, startMonth),
    startYear,
  };
}

/** Whether a date (or the date part of an ISO timestamp) falls inside the fiscal year. */
export function isInFiscalYear(date: string, fiscalYear: FiscalYear): boolean {
  const { year, month, day } = parseIsoDate(date);
  const d = isoDate(year, month, day);
  return d >= fiscalYear.startDate && d <= fiscalYear.endDate;
}
