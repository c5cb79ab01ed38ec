import { and, eq, isNull } from "drizzle-orm";
import { getDb, writeTx, writeTxThen, type InSameTx, type Reader } from "@/db/client";
import { estimateLines, timeEntries } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { checkClockIn, isApprovedState, milliHoursFromSeconds, timeBoxOf, type TimeBox } from "@/lib/estimate";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";
import { toEstimateLine } from "./estimate-context";
import { assertOpen, loadLineContext } from "./estimate-lines";

function seconds(fromIso: string, toIso: string): number {
  return Math.max(0, Math.floor((Date.parse(toIso) - Date.parse(fromIso)) / 1000));
}

/** Thousandths of an hour clocked on a line, counting running entries up to `at`. */
export async function clockedMilli(tx: Reader, lineId: string, at: string): Promise<number> {
  const rows = await tx.select({ startedAt: timeEntries.startedAt, endedAt: timeEntries.endedAt }).from(timeEntries).where(eq(timeEntries.lineId, lineId));
  return rows.reduce((sum, r) => sum + milliHoursFromSeconds(seconds(r.startedAt, r.endedAt ?? at)), 0);
}

/**
 * Clocks the technician onto an approved labour line (closing any other entry
 * they left running). On a diagnosis line the time box is checked first:
 * once the approved hours are used, clocking in is refused until the
 * customer extends it.
 */
export async function clockIn(user: SessionUser, lineId: string) {
  return writeTx(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, lineId);
    assertOpen(ctx);
    if (line.kind !== "labor") throw conflict("not_labour", "Time is clocked on labour lines only.");
    if (!isApprovedState(line.state) || line.state === "done") {
      throw conflict("not_approved", "This line is not approved work in progress; it cannot take time.");
    }
    const at = nowIso();
    const verdict = checkClockIn({ line: toEstimateLine(line), usedMilli: await clockedMilli(tx, line.id, at) });
    if (!verdict.ok) throw conflict(verdict.code, capital(verdict.detail), { amounts: verdict.amounts });

    const open = await tx.select().from(timeEntries).where(and(eq(timeEntries.techId, user.id), isNull(timeEntries.endedAt)));
    for (const entry of open) await tx.update(timeEntries).set({ endedAt: at }).where(eq(timeEntries.id, entry.id));
    const [entry] = await tx.insert(timeEntries).values({ lineId: line.id, workOrderId: ctx.wo.id, techId: user.id, startedAt: at }).returning();
    if (line.state === "approved") {
      await tx.update(estimateLines).set({ state: "in_progress", version: line.version + 1, updatedAt: at }).where(eq(estimateLines.id, line.id));
    }
    await recordAudit(tx, user, { action: "time.clock_in", entityType: "line", entityId: line.id, accountId: ctx.wo.accountId });
    return entry!;
  });
}

export interface ClockOutResult {
  box: TimeBox | null;
  capped: boolean;
  /** True when this clock-out filled the box (the shop and the customer are told). */
  reachedNow: boolean;
  workOrderId: string;
  accountId: string;
  woNumber: number;
  lineDescription: string;
}

/**
 * Stops the technician's running entry on a line. A diagnosis entry never
 * runs past the approved hours: it is cut off where the box filled.
 */
export async function clockOut(user: SessionUser, lineId: string, notify?: InSameTx<ClockOutResult>): Promise<ClockOutResult> {
  return writeTxThen(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, lineId);
    const [entry] = await tx
      .select()
      .from(timeEntries)
      .where(and(eq(timeEntries.lineId, line.id), eq(timeEntries.techId, user.id), isNull(timeEntries.endedAt)))
      .limit(1);
    if (!entry) throw conflict("not_clocked_in", "You are not clocked in on this line.");
    const at = nowIso();
    const estimateLine = toEstimateLine(line);
    let endedAt = at;
    let capped = false;
    const before = (await clockedMilli(tx, line.id, at)) - milliHoursFromSeconds(seconds(entry.startedAt, at));
    const boxBefore = timeBoxOf(estimateLine, before);
    if (boxBefore) {
      const leftMilli = Math.max(0, boxBefore.approvedMilli - before);
      const thisMilli = milliHoursFromSeconds(seconds(entry.startedAt, at));
      if (thisMilli > leftMilli) {
        // 1 thousandth of an hour is 3.6 s.
        endedAt = new Date(Date.parse(entry.startedAt) + Math.floor(leftMilli * 3.6) * 1000).toISOString();
        capped = true;
      }
    }
    await tx
      .update(timeEntries)
      .set({ endedAt, note: capped ? "Stopped at the diagnosis time box." : entry.note })
      .where(eq(timeEntries.id, entry.id));
    const after = await clockedMilli(tx, line.id, at);
    const box = timeBoxOf(estimateLine, after);
    await recordAudit(tx, user, { action: "time.clock_out", entityType: "line", entityId: line.id, accountId: ctx.wo.accountId, detail: { capped } });
    return {
      box,
      capped,
      reachedNow: box?.status === "blocked" && boxBefore?.status !== "blocked",
      workOrderId: ctx.wo.id,
      accountId: ctx.wo.accountId,
      woNumber: ctx.wo.number,
      lineDescription: line.description,
    };
  }, notify);
}

/** Per line: clocked hours, time box, and who is clocked in now. */
export async function timeSummary(workOrderId: string, at = nowIso()) {
  const rows = await getDb()
    .select({ lineId: timeEntries.lineId, techId: timeEntries.techId, startedAt: timeEntries.startedAt, endedAt: timeEntries.endedAt })
    .from(timeEntries)
    .where(eq(timeEntries.workOrderId, workOrderId));
  const byLine = new Map<string, { usedMilli: number; runningTechIds: string[]; runningSince: Record<string, string> }>();
  for (const r of rows) {
    const s = byLine.get(r.lineId) ?? { usedMilli: 0, runningTechIds: [], runningSince: {} };
    s.usedMilli += milliHoursFromSeconds(seconds(r.startedAt, r.endedAt ?? at));
    if (!r.endedAt) {
      s.runningTechIds.push(r.techId);
      s.runningSince[r.techId] = r.startedAt;
    }
    byLine.set(r.lineId, s);
  }
  return byLine;
}

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
