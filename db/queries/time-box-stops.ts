import { and, eq, inArray, isNotNull, isNull, lte, or } from "drizzle-orm";
import type { Reader, Tx } from "@/db/client";
import { estimateLines, timeEntries, type TimeEntry } from "@/db/schema";
import {
  boxApprovedMilli,
  boxRootId,
  diagnosisClock,
  instantReaching,
  MS_PER_MILLI_HOUR,
  timeBoxNoticesDue,
  type ClockSpan,
  type DiagnosisClock,
  type TimeBoxNotice,
} from "@/lib/estimate";
import { toEstimateLine } from "./estimate-context";

/*
 * The diagnosis time box against running clocks. A running entry on a diagnosis line carries the
 * instant it stops by itself (stop_at); every read counts it only up to then, so the truth shows
 * even when nobody is watching. Writes call settleTimeBoxes first (closing clocks whose time has
 * come, and saying which notices are due), and re-plan stop times whenever the box or its clocks
 * change. The watcher (lib/server/notifications/time-box-watch.ts) does the same on a timer.
 */

export function spanOf(entry: Pick<TimeEntry, "startedAt" | "endedAt" | "stopAt">): ClockSpan {
  return {
    startMs: Date.parse(entry.startedAt),
    endMs: entry.endedAt ? Date.parse(entry.endedAt) : null,
    stopAtMs: entry.stopAt ? Date.parse(entry.stopAt) : null,
  };
}

/** A diagnosis line, its extensions, and every entry clocked on them. */
export async function loadBoxGroup(db: Reader, rootId: string) {
  const lines = await db
    .select()
    .from(estimateLines)
    .where(or(eq(estimateLines.id, rootId), eq(estimateLines.extendsLineId, rootId)));
  const root = lines.find((l) => l.id === rootId) ?? null;
  const entries = lines.length
    ? await db.select().from(timeEntries).where(inArray(timeEntries.lineId, lines.map((l) => l.id)))
    : [];
  return { root, lines, entries };
}

export type BoxGroup = Awaited<ReturnType<typeof loadBoxGroup>>;

export function clockOfGroup(group: BoxGroup, atMs: number): DiagnosisClock {
  const approvedMilli = boxApprovedMilli(group.lines.map(toEstimateLine), group.root?.id ?? "");
  return diagnosisClock({ spans: group.entries.map(spanOf), approvedMilli, atMs });
}

/** From `at`, when the running clocks of a diagnosis line's box stop by themselves: stored on each. */
export async function planStops(tx: Tx, rootId: string, at: string): Promise<void> {
  const group = await loadBoxGroup(tx, rootId);
  const running = group.entries.filter((e) => e.endedAt === null);
  if (!running.length) return;
  if (!group.root?.isDiagnosis) {
    await tx.update(timeEntries).set({ stopAt: null }).where(inArray(timeEntries.id, running.map((e) => e.id)));
    return;
  }
  const atMs = Date.parse(at);
  const approvedMilli = boxApprovedMilli(group.lines.map(toEstimateLine), rootId);
  // Planned afresh from now: a stored stop time never moves into the past (settled first by the caller).
  const spans = group.entries.map((e) => ({ ...spanOf(e), stopAtMs: null }));
  const stopMs = instantReaching(spans, approvedMilli * MS_PER_MILLI_HOUR, atMs, "last") ?? atMs;
  await tx
    .update(timeEntries)
    .set({ stopAt: new Date(Math.max(stopMs, atMs)).toISOString() })
    .where(inArray(timeEntries.id, running.map((e) => e.id)));
}

export interface TimeBoxNoticeDue {
  kind: TimeBoxNotice;
  rootLineId: string;
  workOrderId: string;
  description: string;
  approvedMilli: number;
  usedMs: number;
  /** Who has clocked on this box: their phones are told. */
  techIds: string[];
}

/**
 * Closes every running clock whose stop time has come (ended at that instant, never later, never
 * earlier), then says which 80 % / 100 % notices are due for the boxes touched (and `alsoRoots`),
 * marking them sent in the same transaction so each goes once.
 */
export async function settleTimeBoxes(tx: Tx, at: string, alsoRoots: readonly string[] = []): Promise<TimeBoxNoticeDue[]> {
  const due = await tx
    .select({ id: timeEntries.id, lineId: timeEntries.lineId, stopAt: timeEntries.stopAt })
    .from(timeEntries)
    .where(and(isNull(timeEntries.endedAt), isNotNull(timeEntries.stopAt), lte(timeEntries.stopAt, at)));
  for (const e of due) {
    await tx.update(timeEntries).set({ endedAt: e.stopAt, stoppedBy: "time_box" }).where(eq(timeEntries.id, e.id));
  }
  const running = await tx.select({ lineId: timeEntries.lineId }).from(timeEntries).where(isNull(timeEntries.endedAt));
  const lineIds = [...new Set([...due, ...running].map((e) => e.lineId))];
  const touched = lineIds.length
    ? await tx.select({ id: estimateLines.id, extendsLineId: estimateLines.extendsLineId }).from(estimateLines).where(inArray(estimateLines.id, lineIds))
    : [];
  const roots = [...new Set([...touched.map(boxRootId), ...alsoRoots])];
  const atMs = Date.parse(at);
  const notices: TimeBoxNoticeDue[] = [];
  for (const rootId of roots) {
    const group = await loadBoxGroup(tx, rootId);
    const root = group.root;
    if (!root?.isDiagnosis) continue;
    const clock = clockOfGroup(group, atMs);
    for (const kind of timeBoxNoticesDue(clock.box, { warnedMilli: root.boxWarnedMilli, reachedMilli: root.boxReachedMilli })) {
      const sent = kind === "reached" ? { boxWarnedMilli: clock.approvedMilli, boxReachedMilli: clock.approvedMilli } : { boxWarnedMilli: clock.approvedMilli };
      await tx.update(estimateLines).set(sent).where(eq(estimateLines.id, root.id));
      notices.push({
        kind,
        rootLineId: root.id,
        workOrderId: root.workOrderId,
        description: root.description,
        approvedMilli: clock.approvedMilli,
        usedMs: clock.usedMs,
        techIds: [...new Set(group.entries.map((e) => e.techId))],
      });
    }
  }
  return notices;
}

/** The next instant a running clock stops or reaches its 80 % warning: when the watcher looks again. */
export async function nextTimeBoxInstant(db: Reader, at: string): Promise<number | null> {
  const running = await db
    .select({ lineId: timeEntries.lineId, extendsLineId: estimateLines.extendsLineId })
    .from(timeEntries)
    .innerJoin(estimateLines, eq(estimateLines.id, timeEntries.lineId))
    .where(isNull(timeEntries.endedAt));
  const atMs = Date.parse(at);
  let next: number | null = null;
  for (const rootId of new Set(running.map((r) => boxRootId({ id: r.lineId, extendsLineId: r.extendsLineId })))) {
    const group = await loadBoxGroup(db, rootId);
    if (!group.root?.isDiagnosis) continue;
    const clock = clockOfGroup(group, atMs);
    const stored = group.entries.filter((e) => e.endedAt === null && e.stopAt).map((e) => Date.parse(e.stopAt!));
    const warned = group.root.boxWarnedMilli === clock.approvedMilli;
    for (const t of [...stored, ...(warned || clock.warnAtMs === null ? [] : [clock.warnAtMs])]) {
      if (next === null || t < next) next = t;
    }
  }
  return next;
}
