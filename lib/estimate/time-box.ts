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

/*
 * The running clock against the box. Time is kept in epoch milliseconds; one thousandth of an
 * hour is 3 600 ms. Recorded time is never cut back: a running clock stops by itself at the
 * instant the box fills (its stop time is stored on the entry), and anything clocked past the
 * approved hours (a box made smaller later) is kept and shown as past the box.
 */

export const MS_PER_MILLI_HOUR = 3_600;

/** One clocked span; a running one has no end yet and may carry the instant it stops by itself. */
export interface ClockSpan {
  startMs: number;
  endMs: number | null;
  stopAtMs?: number | null;
}

/** Where a span ends when read at `atMs`: its end, else now or its stop time, whichever is first. */
export function spanEndMs(span: ClockSpan, atMs: number): number {
  const end = span.endMs ?? Math.min(atMs, span.stopAtMs ?? Number.POSITIVE_INFINITY);
  return Math.max(span.startMs, end);
}

export function isRunningAt(span: ClockSpan, atMs: number): boolean {
  return span.endMs === null && span.startMs <= atMs && (span.stopAtMs == null || span.stopAtMs > atMs);
}

export function workedMs(spans: readonly ClockSpan[], atMs: number): number {
  return spans.reduce((sum, s) => sum + Math.max(0, spanEndMs(s, atMs) - s.startMs), 0);
}

/** Milliseconds as thousandths of an hour, rounded up so the box never under-counts. */
export function milliHoursFromMs(ms: number): number {
  return Math.ceil(Math.max(0, ms) / MS_PER_MILLI_HOUR);
}

/**
 * The instant the spans running at `fromMs` bring the worked time to `targetMs`, if nothing else
 * changes (each running span adds its own time). "last": the last instant at or under the
 * target (where a clock stops); "first": the first at or over it (when a warning is due).
 * `fromMs` when the target is already reached; null when nothing runs.
 */
export function instantReaching(spans: readonly ClockSpan[], targetMs: number, fromMs: number, mode: "last" | "first" = "last"): number | null {
  const running = spans.filter((s) => isRunningAt(s, fromMs)).length;
  if (running === 0) return null;
  const left = targetMs - workedMs(spans, fromMs);
  if (left <= 0) return fromMs;
  return fromMs + (mode === "last" ? Math.floor(left / running) : Math.ceil(left / running));
}

export interface DiagnosisClock {
  approvedMilli: number;
  usedMs: number;
  usedMilli: number;
  box: TimeBox;
  /** Time clocked past the approved hours: kept, not billable until the customer extends the box. */
  pastMs: number;
  /** When the running clocks stop by themselves (the box fills); null when none runs. */
  stopAtMs: number | null;
  /** When the running clocks reach 80 % of the box; null when none runs or it is passed. */
  warnAtMs: number | null;
}

export function diagnosisClock(input: { spans: readonly ClockSpan[]; approvedMilli: number; atMs: number }): DiagnosisClock {
  const { spans, approvedMilli, atMs } = input;
  const approvedMs = approvedMilli * MS_PER_MILLI_HOUR;
  const usedMs = workedMs(spans, atMs);
  const usedMilli = milliHoursFromMs(usedMs);
  const warnMs = (approvedMs * TIME_BOX_WARN_PERCENT) / 100;
  return {
    approvedMilli,
    usedMs,
    usedMilli,
    box: timeBox(usedMilli, approvedMilli),
    pastMs: Math.max(0, usedMs - approvedMs),
    stopAtMs: instantReaching(spans, approvedMs, atMs, "last"),
    warnAtMs: usedMs >= warnMs ? null : instantReaching(spans, warnMs, atMs, "first"),
  };
}

/** The line whose box a diagnosis line counts against: itself, or the line an extension extends. */
export function boxRootId(line: Pick<EstimateLine, "id" | "extendsLineId">): string {
  return line.extendsLineId ?? line.id;
}

/** Hours the customer approved for a diagnosis line's box: the line and its approved extensions. */
export function boxApprovedMilli(lines: readonly EstimateLine[], rootId: string): number {
  return lines
    .filter((l) => l.isDiagnosis && boxRootId(l) === rootId)
    .reduce((sum, l) => sum + approvedDiagnosisMilli(l), 0);
}

export type TimeBoxNotice = "warn" | "reached";

/**
 * Which notices are due for a box, given the approved hours the last ones were sent for (so an
 * extension starts the count again). A box that filled before anyone was warned sends "reached" only.
 */
export function timeBoxNoticesDue(box: TimeBox, sent: { warnedMilli: number | null; reachedMilli: number | null }): TimeBoxNotice[] {
  if (box.approvedMilli <= 0) return [];
  if (box.status === "blocked") return sent.reachedMilli === box.approvedMilli ? [] : ["reached"];
  if (box.status === "warn") return sent.warnedMilli === box.approvedMilli ? [] : ["warn"];
  return [];
}

/** Clocked time as people read a clock: "1 h 42 min", "18 min", "2 h". */
export function formatClock(ms: number): string {
  const minutes = Math.floor(Math.max(0, ms) / 60_000);
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/** Hours where labour is billed, in tenths: "2.0 h", "1.5 h". */
export function formatTenths(milli: number): string {
  return `${(Math.round(milli / 100) / 10).toFixed(1)} h`;
}
