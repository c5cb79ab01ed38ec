import { and, count, desc, eq, inArray, isNull, max, ne } from "drizzle-orm";
import { getDb, writeTx, type Tx } from "@/db/client";
import { accounts, concerns, occurrences, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { nowIso } from "@/lib/ids";
import { conflict, notFound } from "@/lib/http/problem";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

/** One concern with its unit, account and the visit it was raised on; scoped like everything else. */
export async function findConcern(user: SessionUser, concernId: string) {
  const [row] = await getDb()
    .select({
      id: concerns.id,
      unitId: concerns.unitId,
      workOrderId: concerns.workOrderId,
      complaint: concerns.complaint,
      cause: concerns.cause,
      intermittent: concerns.intermittent,
      recordHint: concerns.recordHint,
      closedAt: concerns.closedAt,
      conclusion: concerns.conclusion,
      createdAt: concerns.createdAt,
      unitNumber: units.unitNumber,
      unitDescription: units.description,
      accountId: units.accountId,
      accountName: accounts.name,
      workOrderNumber: workOrders.number,
    })
    .from(concerns)
    .innerJoin(units, eq(units.id, concerns.unitId))
    .innerJoin(accounts, eq(accounts.id, units.accountId))
    .leftJoin(workOrders, eq(workOrders.id, concerns.workOrderId))
    .where(and(eq(concerns.id, concernId), scopedTo(units.accountId, user)))
    .limit(1);
  return row ?? null;
}

/** The concern, scoped to the caller's account (another account's is not found), refused once closed. */
async function openConcernForWrite(tx: Tx, user: SessionUser, concernId: string, closedMessage: string) {
  const [c] = await tx
    .select({ id: concerns.id, unitId: concerns.unitId, accountId: units.accountId, closedAt: concerns.closedAt, intermittent: concerns.intermittent, cause: concerns.cause })
    .from(concerns)
    .innerJoin(units, eq(units.id, concerns.unitId))
    .where(and(eq(concerns.id, concernId), scopedTo(units.accountId, user)))
    .limit(1);
  if (!c) throw notFound("That concern");
  if (c.closedAt) throw conflict("concern_closed", closedMessage);
  return c;
}

/**
 * Marks a concern intermittent with what the fleet should record. Entries the
 * fleet logged on the unit before any concern was open are attached to it.
 */
export async function markIntermittent(user: SessionUser, concernId: string, recordHint: string) {
  return writeTx(async (tx) => {
    const c = await openConcernForWrite(tx, user, concernId, "That concern is closed; open a new one if the fault is back.");
    await tx.update(concerns).set({ intermittent: true, recordHint, updatedAt: nowIso() }).where(eq(concerns.id, c.id));
    const adopted = c.intermittent
      ? []
      : await tx
          .update(occurrences)
          .set({ concernId: c.id, updatedAt: nowIso() })
          .where(and(eq(occurrences.unitId, c.unitId), isNull(occurrences.concernId)))
          .returning({ id: occurrences.id });
    await recordAudit(tx, user, {
      action: c.intermittent ? "concern.record_hint_changed" : "concern.marked_intermittent",
      entityType: "concern",
      entityId: c.id,
      accountId: c.accountId,
      detail: { recordHint, adopted: adopted.length },
    });
    return { id: c.id, unitId: c.unitId, adopted: adopted.length };
  });
}

/** Closes an intermittent concern with the cause found; the fleet sees the conclusion. */
export async function closeConcern(user: SessionUser, concernId: string, conclusion: string) {
  return writeTx(async (tx) => {
    const c = await openConcernForWrite(tx, user, concernId, "That concern is already closed.");
    const at = nowIso();
    await tx
      .update(concerns)
      .set({ closedAt: at, conclusion, cause: c.cause || conclusion, updatedAt: at })
      .where(eq(concerns.id, c.id));
    await recordAudit(tx, user, { action: "concern.closed", entityType: "concern", entityId: c.id, accountId: c.accountId, detail: { conclusion } });
    return { id: c.id, unitId: c.unitId, closedAt: at };
  });
}

/** Concerns on a visit that could be marked intermittent (open, not yet intermittent). */
export async function markableConcerns(workOrderId: string) {
  return getDb()
    .select({ id: concerns.id, complaint: concerns.complaint })
    .from(concerns)
    .where(and(eq(concerns.workOrderId, workOrderId), eq(concerns.intermittent, false), isNull(concerns.closedAt)))
    .orderBy(concerns.position);
}

/**
 * Intermittent concerns with their log counts, for lists: open ones on the
 * given units (or the caller's whole account), and those closed in the last
 * `closedWithinDays` days so the fleet sees what the shop concluded.
 */
export async function watchedConcerns(user: SessionUser, opts: { unitId?: string; closedWithinDays?: number } = {}) {
  const since = new Date(Date.now() - (opts.closedWithinDays ?? 90) * 86_400_000).toISOString();
  const rows = await getDb()
    .select({
      id: concerns.id,
      unitId: concerns.unitId,
      workOrderId: concerns.workOrderId,
      complaint: concerns.complaint,
      recordHint: concerns.recordHint,
      closedAt: concerns.closedAt,
      conclusion: concerns.conclusion,
      unitNumber: units.unitNumber,
      unitDescription: units.description,
      accountName: accounts.name,
    })
    .from(concerns)
    .innerJoin(units, eq(units.id, concerns.unitId))
    .innerJoin(accounts, eq(accounts.id, units.accountId))
    .where(and(eq(concerns.intermittent, true), scopedTo(units.accountId, user), opts.unitId ? eq(concerns.unitId, opts.unitId) : undefined))
    .orderBy(desc(concerns.createdAt));
  const visible = rows.filter((r) => !r.closedAt || r.closedAt >= since);
  const stats = visible.length
    ? await getDb()
        .select({ concernId: occurrences.concernId, n: count(), last: max(occurrences.occurredAt) })
        .from(occurrences)
        .where(inArray(occurrences.concernId, visible.map((r) => r.id)))
        .groupBy(occurrences.concernId)
    : [];
  const now = Date.now();
  const withStats = visible.map((r) => {
    const s = stats.find((x) => x.concernId === r.id);
    const lastAt = s?.last ?? null;
    return { ...r, count: s?.n ?? 0, lastAt, daysSinceLast: lastAt ? Math.max(0, Math.floor((now - Date.parse(lastAt)) / 86_400_000)) : null };
  });
  return { open: withStats.filter((r) => !r.closedAt), closed: withStats.filter((r) => r.closedAt) };
}

/** Who is working on the unit now: the open visit's technician, for the shop's concern page. */
export async function openVisitOf(unitId: string) {
  const [row] = await getDb()
    .select({ id: workOrders.id, number: workOrders.number, status: workOrders.status, technicianName: users.name })
    .from(workOrders)
    .leftJoin(users, eq(users.id, workOrders.assignedTechId))
    .where(and(eq(workOrders.unitId, unitId), ne(workOrders.status, "released")))
    .limit(1);
  return row ?? null;
}
