/** Dates and times for people, in the shop's time zone. Pure: the clock is passed in. */

import { memoised } from "./intl-cache";

/**
 * The shop's zone (APP_TIME_ZONE). On the server it is read at start; in the
 * browser next.config.ts inlines the value the app was built with.
 */
export const DEFAULT_TIME_ZONE = process.env.APP_TIME_ZONE || "America/Chicago";

/** Whether Intl knows a zone name ("America/Chicago" yes, "Central" no). */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

const shortDate = memoised((timeZone: string) => new Intl.DateTimeFormat("en-US", { month: "short", day: "numeric", year: "numeric", timeZone }));
const shortDateTime = memoised(
  (timeZone: string) => new Intl.DateTimeFormat("en-US", { month: "short", day: "numeric", hour: "numeric", minute: "2-digit", timeZone }),
);
const isoDate = memoised((timeZone: string) => new Intl.DateTimeFormat("en-CA", { year: "numeric", month: "2-digit", day: "2-digit", timeZone }));
const upTo = memoised((maximumFractionDigits: number) => new Intl.NumberFormat("en-US", { maximumFractionDigits }));

export function formatDate(iso: string | null | undefined, timeZone = DEFAULT_TIME_ZONE): string {
  if (!iso) return "—";
  // Calendar dates (YYYY-MM-DD) have no time zone: show them as written.
  const date = /^\d{4}-\d{2}-\d{2}$/.test(iso) ? new Date(`${iso}T12:00:00Z`) : new Date(iso);
  const zone = /^\d{4}-\d{2}-\d{2}$/.test(iso) ? "UTC" : timeZone;
  return shortDate(zone).format(date);
}

export function formatDateTime(iso: string | null | undefined, timeZone = DEFAULT_TIME_ZONE): string {
  if (!iso) return "—";
  return shortDateTime(timeZone).format(new Date(iso));
}

/** "3 min ago", "2 h ago", "4 days ago"; older than two weeks gives the date. */
export function formatAgo(iso: string, now: Date, timeZone = DEFAULT_TIME_ZONE): string {
  const seconds = Math.round((now.getTime() - Date.parse(iso)) / 1000);
  if (seconds < 45) return "just now";
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 24) return `${hours} h ago`;
  const days = Math.round(hours / 24);
  if (days < 14) return `${days} day${days === 1 ? "" : "s"} ago`;
  return formatDate(iso, timeZone);
}

/** Calendar date (YYYY-MM-DD) of an instant in a time zone. */
export function calendarDate(instant: Date, timeZone = DEFAULT_TIME_ZONE): string {
  return isoDate(timeZone).format(instant);
}

export function formatQuantity(milli: number): string {
  return upTo(3).format(milli / 1000);
}

/** A measured number with grouping and at most `maximumFractionDigits` decimals (12,345.6). */
export function formatNumber(value: number, maximumFractionDigits = 0): string {
  return upTo(maximumFractionDigits).format(value);
}

/** A server's detail ("approving $5,200.00 … is $5,000.00") as a sentence: capital first, full stop last. */
export function asSentence(text: string): string {
  const trimmed = text.trim();
  if (!trimmed) return trimmed;
  const capital = trimmed.charAt(0).toUpperCase() + trimmed.slice(1);
  return /[.!?…]$/.test(capital) ? capital : `${capital}.`;
}

/** The technician on a visit as it is: assigned, or (with nobody assigned) whoever clocked time on it. */
export function technicianLabel(assigned: string | null, clocked: string | null | undefined): string {
  if (assigned) return assigned;
  return clocked ? `${clocked} (clocked on it, not assigned)` : "not assigned";
}

/** A complaint as a visit's title: the first sentence, cut at a word near `max` characters with an ellipsis. */
export function shortTitle(text: string, max = 70): string {
  const first = text.replace(/\s+\(reported by [^)]*\)\s*$/, "").split(/(?<=[.;!?])\s/)[0]!.trim().replace(/[.;]$/, "");
  if (first.length <= max) return first;
  const cut = first.slice(0, max);
  const space = cut.lastIndexOf(" ");
  return `${(space > max / 2 ? cut.slice(0, space) : cut).replace(/[,;:\s]+$/, "")}…`;
}
