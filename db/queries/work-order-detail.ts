import { and, asc, desc, eq, inArray, isNotNull } from "drizzle-orm";
import { getDb, type Reader } from "@/db/client";
import { accounts, concerns, decisions, findingReadings, findings, photos, statusEvents, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { SEVERITIES } from "@/lib/domain";
import { photoUrls } from "@/lib/uploads/photo-urls";
import { scopedTo } from "./scope";
import { clockedTechNameSql } from "./time-clock";

/** The work order's header row, scoped: null for an id that does not exist or belongs to another account. */
export async function findWorkOrder(user: SessionUser, id: string, db: Reader = getDb()) {
  const [row] = await db
    .select({
      id: workOrders.id,
      number: workOrders.number,
      unitId: workOrders.unitId,
      accountId: workOrders.accountId,
      status: workOrders.status,
      title: workOrders.title,
      promisedAt: workOrders.promisedAt,
      poNumber: workOrders.poNumber,
      openedAt: workOrders.openedAt,
      sentForApprovalAt: workOrders.sentForApprovalAt,
      releasedAt: workOrders.releasedAt,
      updatedAt: workOrders.updatedAt,
      assignedTechId: workOrders.assignedTechId,
      technicianName: users.name,
      clockedTechName: clockedTechNameSql(),
      unitNumber: units.unitNumber,
      unitDescription: units.description,
      unitYear: units.year,
      vin: units.vin,
      accountName: accounts.name,
    })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .innerJoin(accounts, eq(accounts.id, workOrders.accountId))
    .leftJoin(users, eq(users.id, workOrders.assignedTechId))
    .where(and(eq(workOrders.id, id), scopedTo(workOrders.accountId, user)))
    .limit(1);
  return row ?? null;
}

export async function loadTimeline(workOrderId: string) {
  return getDb()
    .select({ id: statusEvents.id, status: statusEvents.status, note: statusEvents.note, at: statusEvents.at, by: users.name })
    .from(statusEvents)
    .leftJoin(users, eq(users.id, statusEvents.byUserId))
    .where(eq(statusEvents.workOrderId, workOrderId))
    .orderBy(desc(statusEvents.at));
}

export async function loadConcerns(workOrderId: string) {
  return getDb()
    .select({
      id: concerns.id,
      position: concerns.position,
      complaint: concerns.complaint,
      cause: concerns.cause,
      correction: concerns.correction,
      intermittent: concerns.intermittent,
      recordHint: concerns.recordHint,
      closedAt: concerns.closedAt,
      conclusion: concerns.conclusion,
    })
    .from(concerns)
    .where(eq(concerns.workOrderId, workOrderId))
    .orderBy(asc(concerns.position), asc(concerns.createdAt));
}

/** Findings with photos and checked readings; Out of service first, then by severity, newest first. */
export async function loadFindings(workOrderId: string) {
  const db = getDb();
  const rows = await db
    .select({
      id: findings.id,
      concernId: findings.concernId,
      title: findings.title,
      severity: findings.severity,
      noteMarkdown: findings.noteMarkdown,
      createdAt: findings.createdAt,
      createdBy: users.name,
    })
    .from(findings)
    .leftJoin(users, eq(users.id, findings.createdBy))
    .where(eq(findings.workOrderId, workOrderId))
    .orderBy(desc(findings.createdAt));
  const ids = rows.map((r) => r.id);
  const [photoRows, readingRows] = ids.length
    ? await Promise.all([
        db
          .select({ id: photos.id, findingId: photos.findingId, name: photos.name, width: photos.width, height: photos.height })
          .from(photos)
          // By the work order (a finding's photos are attached on its visit): one ordered index range.
          .where(and(eq(photos.workOrderId, workOrderId), isNotNull(photos.findingId)))
          .orderBy(asc(photos.createdAt)),
        db.select().from(findingReadings).where(inArray(findingReadings.findingId, ids)).orderBy(asc(findingReadings.position)),
      ])
    : [[], []];
  return rows
    .map((f) => ({
      ...f,
      photos: photoRows.filter((p) => p.findingId === f.id).map((p) => ({ id: p.id, name: p.name, width: p.width, height: p.height, ...photoUrls(p.id) })),
      readings: readingRows
        .filter((r) => r.findingId === f.id)
        .map((r) => ({
          id: r.id,
          kind: r.kind,
          location: r.location,
          value: r.value,
          unit: r.unit,
          verdict: r.verdict,
          limit: r.limitText,
          limitValue: r.limitValue,
          source: r.source,
          sourceKind: r.sourceKind,
          note: r.note,
          input: r.input,
        })),
    }))
    .sort((a, b) => SEVERITIES.indexOf(a.severity) - SEVERITIES.indexOf(b.severity));
}

export type FindingView = Awaited<ReturnType<typeof loadFindings>>[number];

/** The latest decision on each line, with who made it. */
export async function loadLatestDecisions(workOrderId: string) {
  const rows = await getDb()
    .select({
      id: decisions.id,
      lineId: decisions.lineId,
      decision: decisions.decision,
      byStanding: decisions.byStanding,
      amountCents: decisions.amountCents,
      lineVersion: decisions.lineVersion,
      note: decisions.note,
      at: decisions.at,
      by: users.name,
    })
    .from(decisions)
    .leftJoin(users, eq(users.id, decisions.byUserId))
    .where(eq(decisions.workOrderId, workOrderId))
    .orderBy(desc(decisions.at));
  const latest = new Map<string, (typeof rows)[number]>();
  for (const r of rows) if (!latest.has(r.lineId)) latest.set(r.lineId, r);
  return { latest, all: rows };
}

/** Internal, unscoped: the facts an e-mail about a work order needs (never returned to a browser). */
export async function workOrderForMail(id: string, db: Reader = getDb()) {
  const [row] = await db
    .select({
      id: workOrders.id,
      number: workOrders.number,
      accountId: workOrders.accountId,
      createdBy: workOrders.createdBy,
      assignedTechId: workOrders.assignedTechId,
      title: workOrders.title,
      unitId: workOrders.unitId,
      unitNumber: units.unitNumber,
    })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(eq(workOrders.id, id))
    .limit(1);
  if (!row) throw new Error(`work order ${id} vanished`);
  return row;
}
