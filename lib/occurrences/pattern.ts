import { formatNumber } from "@/lib/specs/exact";
import { formatDegrees, inUnit, milliDegrees, type TemperatureUnit } from "./temperature";

/** What the summary needs of one occurrence (plain data: the API row fits). */
export interface OccurrencePoint {
  occurredAt: string;
  hoursParked: number | null;
  ambientC: number | null;
  batteryVolts: number | null;
  recovered: boolean | null;
}

export interface PatternOptions {
  now: Date | number;
  unit?: TemperatureUnit;
}

export interface PatternSummary {
  total: number;
  parked: { known: number; threshold: number | null; over: number; shortest: number | null; longest: number | null };
  temperature: { known: number; unit: TemperatureUnit; threshold: number | null; below: number; coldest: number | null; warmest: number | null };
  battery: { known: number; lowest: number | null; highest: number | null };
  recovered: { yes: number; no: number; unknown: number };
  firstAt: string | null;
  lastAt: string | null;
  daysSinceLast: number | null;
  /** e.g. "5 of 6 after more than 10 h parked, all below 25 °F" */
  headline: string;
  lines: string[];
}

/** Round soak times a shop would say out loud ("more than 10 h parked"). */
export const PARK_STEPS_H = [1, 2, 4, 6, 8, 10, 12, 16, 24, 36, 48, 72] as const;
/** Temperature thresholds in whole 5-degree steps of the unit being read. */
export const TEMP_STEP = 5;
/** A threshold is worth saying when it covers at least this share (4 in 5). */
export const PATTERN_SHARE = { num: 4, den: 5 } as const;
/** Below this many entries nothing is called a pattern. */
export const MIN_FOR_PATTERN = 3;

const DAY_MS = 86_400_000;

function needed(known: number): number {
  return Math.ceil((known * PATTERN_SHARE.num) / PATTERN_SHARE.den);
}

/**
 * The tightest step that still covers most values, and the one covering all.
 * When "all" is only one step looser than "most", the all-statement is said
 * instead: "all below 25 °F" reads better than "5 of 6 below 20 °F".
 */
function chooseThreshold(steps: readonly number[], covers: (step: number) => number, known: number, tightestFirst: boolean) {
  const order = tightestFirst ? steps : [...steps].reverse();
  const mostIndex = order.findIndex((s) => covers(s) >= needed(known));
  if (mostIndex < 0) return null;
  const allIndex = order.findIndex((s) => covers(s) === known);
  const index = allIndex >= 0 && allIndex - mostIndex <= 1 ? allIndex : mostIndex;
  const step = order[index]!;
  return { step, count: covers(step) };
}

function temperatureSteps(unit: TemperatureUnit): number[] {
  const [lo, hi] = unit === "F" ? [-80, 145] : [-60, 65];
  const out: number[] = [];
  for (let t = lo; t <= hi; t += TEMP_STEP) out.push(t);
  return out;
}

function countPhrase(count: number, known: number, total: number): string {
  if (count === known) return known === total ? "all" : `all ${known} recorded`;
  return `${count} of ${known}`;
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function summarizePattern(points: readonly OccurrencePoint[], options: PatternOptions): PatternSummary {
  const unit = options.unit ?? "F";
  const now = typeof options.now === "number" ? options.now : options.now.getTime();
  const total = points.length;

  const hours = points.flatMap((p) => (p.hoursParked === null ? [] : [p.hoursParked]));
  const tempsMilli = points.flatMap((p) => (p.ambientC === null ? [] : [milliDegrees(inUnit(p.ambientC, unit))]));
  const volts = points.flatMap((p) => (p.batteryVolts === null ? [] : [p.batteryVolts]));

  const parkedChoice =
    hours.length >= MIN_FOR_PATTERN ? chooseThreshold(PARK_STEPS_H, (h) => hours.filter((x) => x > h).length, hours.length, false) : null;
  const tempChoice =
    tempsMilli.length >= MIN_FOR_PATTERN
      ? chooseThreshold(temperatureSteps(unit), (t) => tempsMilli.filter((x) => x < t * 1000).length, tempsMilli.length, true)
      : null;

  const times = points.map((p) => Date.parse(p.occurredAt)).filter((t) => Number.isFinite(t)).sort((a, b) => a - b);
  const first = times[0];
  const last = times.at(-1);

  const summary: PatternSummary = {
    total,
    parked: {
      known: hours.length,
      threshold: parkedChoice?.step ?? null,
      over: parkedChoice?.count ?? 0,
      shortest: hours.length ? Math.min(...hours) : null,
      longest: hours.length ? Math.max(...hours) : null,
    },
    temperature: {
      known: tempsMilli.length,
      unit,
      threshold: tempChoice?.step ?? null,
      below: tempChoice?.count ?? 0,
      coldest: tempsMilli.length ? Math.min(...tempsMilli) / 1000 : null,
      warmest: tempsMilli.length ? Math.max(...tempsMilli) / 1000 : null,
    },
    battery: { known: volts.length, lowest: volts.length ? Math.min(...volts) : null, highest: volts.length ? Math.max(...volts) : null },
    recovered: {
      yes: points.filter((p) => p.recovered === true).length,
      no: points.filter((p) => p.recovered === false).length,
      unknown: points.filter((p) => p.recovered === null).length,
    },
    firstAt: first === undefined ? null : new Date(first).toISOString(),
    lastAt: last === undefined ? null : new Date(last).toISOString(),
    // A time a few minutes ahead (a phone's clock) still counts as today.
    daysSinceLast: last === undefined ? null : Math.max(0, Math.floor((now - last) / DAY_MS)),
    headline: "",
    lines: [],
  };
  summary.headline = headline(summary);
  summary.lines = detailLines(summary);
  return summary;
}

function parkedPhrase(s: PatternSummary): string | null {
  const p = s.parked;
  if (p.threshold === null) return null;
  return `${countPhrase(p.over, p.known, s.total)} after more than ${p.threshold} h parked`;
}

function temperaturePhrase(s: PatternSummary): string | null {
  const t = s.temperature;
  if (t.threshold === null) return null;
  return `${countPhrase(t.below, t.known, s.total)} below ${formatDegrees(t.threshold)} °${t.unit}`;
}

function headline(s: PatternSummary): string {
  if (s.total === 0) return "Nothing logged yet.";
  const phrases = [parkedPhrase(s), temperaturePhrase(s)].filter((x): x is string => x !== null);
  if (phrases.length === 0) {
    return s.total < MIN_FOR_PATTERN ? `${plural(s.total, "occurrence")} logged: too few to see a pattern yet.` : `${plural(s.total, "occurrence")} logged: no clear pattern in soak time or temperature yet.`;
  }
  const text = phrases.join(", ");
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function detailLines(s: PatternSummary): string[] {
  const lines: string[] = [];
  const { parked, temperature, battery, recovered } = s;
  if (parked.known > 0) {
    const range = parked.shortest === parked.longest ? `${formatNumber(parked.shortest ?? 0, 1)} h` : `${formatNumber(parked.shortest ?? 0, 1)}–${formatNumber(parked.longest ?? 0, 1)} h`;
    lines.push(`Parked ${range} before it happened (${parked.known} of ${s.total} gave a time).`);
  }
  if (temperature.known > 0 && temperature.coldest !== null && temperature.warmest !== null) {
    lines.push(
      `Outside ${formatDegrees(temperature.coldest)} to ${formatDegrees(temperature.warmest)} °${temperature.unit} (${temperature.known} of ${s.total} gave a temperature).`,
    );
  }
  if (battery.known > 0 && battery.lowest !== null && battery.highest !== null) {
    const range = battery.lowest === battery.highest ? `${formatNumber(battery.lowest, 2)} V` : `${formatNumber(battery.lowest, 2)}–${formatNumber(battery.highest, 2)} V`;
    lines.push(`Battery ${range} where measured (${plural(battery.known, "reading")}).`);
  }
  if (s.total > 0) lines.push(`Came right by itself ${recovered.yes} of ${s.total} times${recovered.unknown ? ` (${recovered.unknown} not said)` : ""}.`);
  return lines;
}

/** "today", "1 day ago", "12 days ago". */
export function daysSincePhrase(days: number | null): string {
  if (days === null) return "never";
  if (days === 0) return "today";
  return `${plural(days, "day")} ago`;
}
