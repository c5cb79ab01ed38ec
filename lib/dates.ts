/** Calendar arithmetic in a named time zone, with Intl only (no library, no I/O). */

import { memoised } from "./intl-cache";

const wallClock = memoised(
  (timeZone: string) =>
    new Intl.DateTimeFormat("en-US", { timeZone, hourCycle: "h23", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", second: "2-digit" }),
);
const formInput = memoised(
  (timeZone: string) => new Intl.DateTimeFormat("en-CA", { timeZone, hourCycle: "h23", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit" }),
);

function offsetMinutes(instant: number, timeZone: string): number {
  const parts = wallClock(timeZone).formatToParts(instant);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const asUtc = Date.UTC(get("year"), get("month") - 1, get("day"), get("hour"), get("minute"), get("second"));
  return Math.round((asUtc - Math.floor(instant / 1000) * 1000) / 60_000);
}

/** The UTC instant (ISO) at which a calendar date (YYYY-MM-DD) begins in a time zone. */
export function startOfDayIso(date: string, timeZone: string): string {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  const guess = Date.UTC(y, m - 1, d);
  // Two passes settle days on which the offset changes (daylight saving).
  let instant = guess - offsetMinutes(guess, timeZone) * 60_000;
  instant = guess - offsetMinutes(instant, timeZone) * 60_000;
  return new Date(instant).toISOString();
}

/** Noon of a calendar date in a time zone, as an ISO instant: a time that stays on that day anywhere. */
export function localMiddayIso(date: string, timeZone: string): string {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  const noonUtc = Date.UTC(y, m - 1, d, 12);
  return new Date(noonUtc - offsetMinutes(noonUtc, timeZone) * 60_000).toISOString();
}

const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** A real calendar date written YYYY-MM-DD (2026-02-30 is not). */
export function isCalendarDate(text: string): boolean {
  return DATE.test(text) && !Number.isNaN(Date.parse(`${text}T00:00:00Z`)) && new Date(`${text}T00:00:00Z`).toISOString().startsWith(text);
}

/** YYYY-MM-DD plus n days. */
export function addDays(date: string, days: number): string {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** Whole days from one calendar date to another (b − a). */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

/** A wall-clock time typed in a form ("2026-05-04T16:30") in a time zone, as an ISO instant; null if it is not one. */
export function localDateTimeIso(value: string, timeZone: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(value);
  if (!m || !isCalendarDate(`${m[1]}-${m[2]}-${m[3]}`)) return null;
  const [, y, mo, d, h, mi] = m.map(Number) as [number, number, number, number, number, number];
  if (h > 23 || mi > 59) return null;
  const guess = Date.UTC(y, mo - 1, d, h, mi);
  let instant = guess - offsetMinutes(guess, timeZone) * 60_000;
  instant = guess - offsetMinutes(instant, timeZone) * 60_000;
  return new Date(instant).toISOString();
}

/** The form value ("YYYY-MM-DDTHH:mm") of an instant in a time zone, for a datetime-local input. */
export function toLocalDateTimeInput(iso: string, timeZone: string): string {
  const parts = formInput(timeZone).formatToParts(new Date(iso));
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? "00";
  return `${get("year")}-${get("month")}-${get("day")}T${get("hour")}:${get("minute")}`;
}
