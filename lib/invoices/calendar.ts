/** Calendar-date arithmetic on YYYY-MM-DD strings (no time zone involved once a date is a date). */

const DATE = /^\d{4}-\d{2}-\d{2}$/;

export function isCalendarDate(text: string): boolean {
  return DATE.test(text) && !Number.isNaN(Date.parse(`${text}T00:00:00Z`)) && new Date(`${text}T00:00:00Z`).toISOString().startsWith(text);
}

/** YYYY-MM-DD plus n days. */
export function addDays(date: string, days: number): string {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** Whole days from a to b (b − a). */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

/** Minutes the zone is ahead of UTC at an instant (−360 for Chicago in winter). */
function offsetMinutes(instant: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat("en-US", {
    timeZone,
    hourCycle: "h23",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
  }).formatToParts(instant);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const asUtc = Date.UTC(get("year"), get("month") - 1, get("day"), get("hour"), get("minute"));
  return Math.round((asUtc - Math.floor(instant / 60_000) * 60_000) / 60_000);
}

/** Noon of a calendar date in a time zone, as an ISO instant: a time that stays on that day anywhere. */
export function localMiddayIso(date: string, timeZone: string): string {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  const noonUtc = Date.UTC(y, m - 1, d, 12);
  return new Date(noonUtc - offsetMinutes(noonUtc, timeZone) * 60_000).toISOString();
}
