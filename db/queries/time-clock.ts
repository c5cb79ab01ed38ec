import { and, desc, eq, inArray, isNull, sql, type SQL } from "drizzle-orm";
import { getDb, writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { estimateLines, timeEntries, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { boxRootId, formatClock, formatTenths, isApprovedState, type DiagnosisClock } from "@/lib/estimate";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";
import { assertOpen, loadLineContext } from "./estimate-lines";
import { clockOfGroup, loadBoxGroup, planStops, settleTimeBoxes, spanOf, type TimeBoxNoticeDue } from "./time-box-stops";

/** Closes the technician's other running clocks at `at` (or where they stopped by themselves). */
async function closeOthers(tx: Tx, techId: string, at: string): Promise<void> {
  const open = await tx
    .select({ id: timeEntries.id, lineId: timeEntries.lineId, extendsLineId: estimateLines.extendsLineId })
    .from(timeEntries)
    .innerJoin(estimateLines, eq(estimateLines.id, timeEntries.lineId))
    .where(and(eq(timeEntries.techId, techId), isNull(timeEntries.endedAt)));
  for (const entry of open) {
    await tx.update(timeEntries).set({ endedAt: at, stoppedBy: "tech" }).where(eq(timeEntries.id, entry.id));
    await planStops(tx, boxRootId({ id: entry.lineId, extendsLineId: entry.extendsLineId }), at);
  }
}

/**
 * Clocks the technician onto an approved labour line (closing any other clock they left
 * running). An extension line's time goes on the diagnosis line it extends. On a diagnosis line
 * the box is checked first (refused once the approved hours are used, until the customer
 * extends it) and the clock's stop time is stored: it stops by itself when the box fills.
 */
export async function clockIn(user: SessionUser, lineId: string, notify?: InSameTx<{ notices: TimeBoxNoticeDue[] }>) {
  return writeTxThen(async (tx) => {
    const at = nowIso();
    const notices = await settleTimeBoxes(tx, at);
    const { ctx, line: picked } = await loadLineContext(tx, user, lineId);
    assertOpen(ctx);
    const line = ctx.lines.find((l) => l.id === boxRootId(picked)) ?? picked;
    if (line.kind !== "labor") throw conflict("not_labour", "Time is clocked on labour lines only.");
    if (!isApprovedState(line.state) || line.state === "done") {
      throw conflict("not_approved", "This line is not approved work in progress; it cannot take time.");
    }
    if (line.isDiagnosis) {
      const clock = clockOfGroup(await loadBoxGroup(tx, line.id), Date.parse(at));
      if (clock.box.status === "blocked") {
        throw conflict(
          "time_box_reached",
          `Diagnosis time is at ${formatClock(clock.usedMs)} of the ${formatTenths(clock.approvedMilli)} the customer approved; ` +
            "the time box needs extending before clocking in again.",
          { amounts: { usedMilli: clock.usedMilli, approvedMilli: clock.approvedMilli } },
        );
      }
    }
    await closeOthers(tx, user.id, at);
    const [entry] = await tx.insert(timeEntries).values({ lineId: line.id, workOrderId: ctx.wo.id, techId: user.id, startedAt: at }).returning();
    if (line.state === "approved") {
      await tx.update(estimateLines).set({ state: "in_progress", version: line.version + 1, updatedAt: at }).where(eq(estimateLines.id, line.id));
    }
    await planStops(tx, line.id, at);
    await recordAudit(tx, user, { action: "time.clock_in", entityType: "line", entityId: line.id, accountId: ctx.wo.accountId });
    const [stored] = await tx.select().from(timeEntries).where(eq(timeEntries.id, entry!.id));
    return { entry: stored!, notices: [...notices, ...(await settleTimeBoxes(tx, at, [line.id]))] };
  }, notify);
}

export interface ClockOutResult {
  clock: DiagnosisClock | null;
  /** The clock had already stopped by itself at the time box, at this instant. */
  stoppedByBoxAt: string | null;
  notices: TimeBoxNoticeDue[];
  workOrderId: string;
}

/**
 * Stops the technician's running clock on a line. Every minute clocked is kept: nothing is cut
 * back. A diagnosis clock that already stopped by itself at the box says so instead.
 */
export async function clockOut(user: SessionUser, lineId: string, notify?: InSameTx<ClockOutResult>): Promise<ClockOutResult> {
  return writeTxThen(async (tx) => {
    const at = nowIso();
    const notices = await settleTimeBoxes(tx, at);
    const { ctx, line: picked } = await loadLineContext(tx, user, lineId);
    const rootId = boxRootId(picked);
    const mine = await tx
      .select()
      .from(timeEntries)
      .where(and(eq(timeEntries.lineId, rootId), eq(timeEntries.techId, user.id)))
      .orderBy(desc(timeEntries.startedAt));
    // The running clock if there is one, else the last one (it may have stopped by itself).
    const entry = mine.find((e) => e.endedAt === null) ?? mine[0];
    let stoppedByBoxAt: string | null = null;
    if (entry && entry.endedAt === null) {
      await tx.update(timeEntries).set({ endedAt: at, stoppedBy: "tech", stopAt: null }).where(eq(timeEntries.id, entry.id));
      await planStops(tx, rootId, at);
    } else if (entry?.stoppedBy === "time_box") {
      stoppedByBoxAt = entry.endedAt;
    } else {
      throw conflict("not_clocked_in", "You are not clocked in on this line.");
    }
    const group = await loadBoxGroup(tx, rootId);
    const clock = group.root?.isDiagnosis ? clockOfGroup(group, Date.parse(at)) : null;
    await recordAudit(tx, user, { action: "time.clock_out", entityType: "line", entityId: rootId, accountId: ctx.wo.accountId, detail: { stoppedByBoxAt } });
    return { clock, stoppedByBoxAt, notices: [...notices, ...(await settleTimeBoxes(tx, at, [rootId]))], workOrderId: ctx.wo.id };
  }, notify);
}

export interface LineTime {
  spans: { techId: string; startMs: number; endMs: number | null; stopAtMs: number | null }[];
}

/** Per line (extension lines folded into the line they extend): every clocked span, for the clock on the page. */
export async function timeSummary(workOrderId: string) {
  const db = getDb();
  const rows = await db
    .select({ lineId: timeEntries.lineId, techId: timeEntries.techId, startedAt: timeEntries.startedAt, endedAt: timeEntries.endedAt, stopAt: timeEntries.stopAt })
    .from(timeEntries)
    .where(eq(timeEntries.workOrderId, workOrderId));
  const lineIds = [...new Set(rows.map((r) => r.lineId))];
  const ext = lineIds.length
    ? await db.select({ id: estimateLines.id, extendsLineId: estimateLines.extendsLineId }).from(estimateLines).where(inArray(estimateLines.id, lineIds))
    : [];
  const rootOf = new Map(ext.map((l) => [l.id, boxRootId(l)]));
  const byLine = new Map<string, LineTime>();
  for (const r of rows) {
    const key = rootOf.get(r.lineId) ?? r.lineId;
    const s = byLine.get(key) ?? { spans: [] };
    const span = spanOf(r);
    s.spans.push({ techId: r.techId, startMs: span.startMs, endMs: span.endMs, stopAtMs: span.stopAtMs ?? null });
    byLine.set(key, s);
  }
  return byLine;
}

/** Who clocked on a work order most recently (running clocks first): a visit with time on it has a technician. */
export function clockedTechNameSql(workOrderId: SQL | typeof workOrders.id = workOrders.id): SQL<string | null> {
  return sql<string | null>`(select u.name from time_entries t join users u on u.id = t.tech_id where t.work_order_id = ${workOrderId} order by t.ended_at is null desc, t.started_at desc limit 1)`;
}
