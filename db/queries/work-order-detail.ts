import { and, asc, desc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import { getDb, type Reader } from "@/db/client";
import { prepared } from "@/db/prepared";
import { accounts, concerns, decisions, findingReadings, findings, photos, statusEvents, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { SEVERITIES } from "@/lib/domain";
import { photoUrls } from "@/lib/uploads/photo-urls";
import { scopedToPlaceholder, scopeOf } from "./scope";
import { clockedTechNameSql } from "./time-clock";

// The hot reads of a work order's page and view are built once (db/prepared.ts), with placeholders for their inputs.
const workOrderHeader = prepared((db) =>
  db
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
    .where(and(eq(workOrders.id, sql.placeholder("id")), scopedToPlaceholder(workOrders.accountId)))
    .limit(1)
    .prepare(),
);

/** The work order's header row, scoped: null for an id that does not exist or belongs to another account. */
export async function findWorkOrder(user: SessionUser, id: string, db: Reader = getDb()) {
  return (await workOrderHeader(db).get({ id, ...scopeOf(user) })) ?? null;
}

const timeline = prepared((db) =>
  db
    .select({ id: statusEvents.id, status: statusEvents.status, note: statusEvents.note, at: statusEvents.at, by: users.name })
    .from(statusEvents)
    .leftJoin(users, eq(users.id, statusEvents.byUserId))
    .where(eq(statusEvents.workOrderId, sql.placeholder("wo")))
    .orderBy(desc(statusEvents.at))
    .prepare(),
);

export async function loadTimeline(workOrderId: string) {
  return timeline(getDb()).all({ wo: workOrderId });
}

const concernRows = prepared((db) =>
  db
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
    .where(eq(concerns.workOrderId, sql.placeholder("wo")))
    .orderBy(asc(concerns.position), asc(concerns.createdAt))
    .prepare(),
);

export async function loadConcerns(workOrderId: string) {
  return concernRows(getDb()).all({ wo: workOrderId });
}

const findingRows = prepared((db) =>
  db
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
    .where(eq(findings.workOrderId, sql.placeholder("wo")))
    .orderBy(desc(findings.createdAt))
    .prepare(),
);

const findingPhotos = prepared((db) =>
  db
    .select({ id: photos.id, findingId: photos.findingId, name: photos.name, width: photos.width, height: photos.height })
    .from(photos)
    // By the work order (a finding's photos are attached on its visit): one ordered index range.
    .where(and(eq(photos.workOrderId, sql.placeholder("wo")), isNotNull(photos.findingId)))
    .orderBy(asc(photos.createdAt))
    .prepare(),
);

const findingReadingRows = prepared((db) =>
  db
    .select()
    .from(findingReadings)
    .where(inArray(findingReadings.findingId, db.select({ id: findings.id }).from(findings).where(eq(findings.workOrderId, sql.placeholder("wo")))))
    .orderBy(asc(findingReadings.position))
    .prepare(),
);

/** Findings with photos and checked readings; Out of service first, then by severity, newest first. */
export async function loadFindings(workOrderId: string) {
  const db = getDb();
  const wo = { wo: workOrderId };
  const rows = await findingRows(db).all(wo);
  const [photoRows, readingRows] = rows.length ? await Promise.all([findingPhotos(db).all(wo), findingReadingRows(db).all(wo)]) : [[], []];
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

const decisionRows = prepared((db) =>
  db
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
    .where(eq(decisions.workOrderId, sql.placeholder("wo")))
    .orderBy(desc(decisions.at))
    .prepare(),
);

/** The latest decision on each line, with who made it. */
export async function loadLatestDecisions(workOrderId: string) {
  const rows = await decisionRows(getDb()).all({ wo: workOrderId });
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
