import { and, desc, eq, isNull, lt, or, type SQL } from "drizzle-orm";
import { getDb, writeTx, writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { concerns, occurrences, units, users, workOrders } from "@/db/schema";
import { isStaff } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";
import { nowIso } from "@/lib/ids";
import { decodeCursor, paginate, type PageQuery } from "@/lib/http/pagination";
import { forbidden, invalidInput, notFound } from "@/lib/http/problem";
import type { OccurrenceInput, OccurrencePatch } from "@/lib/validation/occurrence";
import { recordAudit } from "./audit";
import { attachOccurrencePhoto, detachOccurrencePhotos, photosOfOccurrences, type OccurrencePhotoRef } from "./occurrence-photos";
import { scopedTo } from "./scope";

/** The unit, only if the caller may see it: another account's unit is simply not found. */
export async function findScopedUnit(user: SessionUser, unitId: string, db: Pick<Tx, "select"> = getDb()) {
  const [unit] = await db
    .select({ id: units.id, accountId: units.accountId, unitNumber: units.unitNumber, description: units.description })
    .from(units)
    .where(and(eq(units.id, unitId), scopedTo(units.accountId, user)))
    .limit(1);
  return unit ?? null;
}

const occurrenceColumns = {
  id: occurrences.id,
  unitId: occurrences.unitId,
  concernId: occurrences.concernId,
  occurredAt: occurrences.occurredAt,
  hoursParked: occurrences.hoursParked,
  ambientC: occurrences.ambientC,
  symptom: occurrences.symptom,
  symptomText: occurrences.symptomText,
  batteryVolts: occurrences.batteryVolts,
  recovered: occurrences.recovered,
  note: occurrences.note,
  createdById: occurrences.createdBy,
  createdByName: users.name,
  createdAt: occurrences.createdAt,
  updatedAt: occurrences.updatedAt,
};

function occurrenceQuery(where: SQL | undefined) {
  return getDb().select(occurrenceColumns).from(occurrences).leftJoin(users, eq(users.id, occurrences.createdBy)).where(where);
}

type OccurrenceRow = Awaited<ReturnType<typeof occurrenceQuery>>[number];

/** The API's shape for one entry; `canEdit` tells the caller whether PATCH would be allowed. */
export function occurrenceJson(row: OccurrenceRow, user: SessionUser, photo: OccurrencePhotoRef | null = null) {
  const { createdById, createdByName, ...rest } = row;
  return {
    ...rest,
    createdBy: createdById ? { id: createdById, name: createdByName ?? "" } : null,
    photo: photo ? { id: photo.id, url: `/api/v1/photos/${photo.id}`, thumbUrl: `/api/v1/photos/${photo.id}/thumb` } : null,
    canEdit: isStaff(user) || createdById === user.id,
  };
}

export type OccurrenceJson = ReturnType<typeof occurrenceJson>;

const concernColumns = {
  id: concerns.id,
  unitId: concerns.unitId,
  workOrderId: concerns.workOrderId,
  complaint: concerns.complaint,
  intermittent: concerns.intermittent,
  recordHint: concerns.recordHint,
  closedAt: concerns.closedAt,
  conclusion: concerns.conclusion,
  createdAt: concerns.createdAt,
};

/** Intermittent concerns on a unit (open first, then closed newest first), across every visit. */
export async function unitIntermittentConcerns(unitId: string) {
  const rows = await getDb()
    .select({ ...concernColumns, workOrderNumber: workOrders.number })
    .from(concerns)
    .leftJoin(workOrders, eq(workOrders.id, concerns.workOrderId))
    .where(and(eq(concerns.unitId, unitId), eq(concerns.intermittent, true)))
    .orderBy(desc(concerns.createdAt));
  return [...rows.filter((c) => !c.closedAt), ...rows.filter((c) => c.closedAt).sort((a, b) => (b.closedAt ?? "").localeCompare(a.closedAt ?? ""))];
}

export type IntermittentConcern = Awaited<ReturnType<typeof unitIntermittentConcerns>>[number];

export async function listOccurrences(
  user: SessionUser,
  unitId: string,
  opts: PageQuery & { concernId?: string },
) {
  const unit = await findScopedUnit(user, unitId);
  if (!unit) throw notFound("That unit");
  const after = decodeCursor(opts.cursor, 2);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
  const [afterAt, afterId] = after ?? [];

  const rows = await occurrenceQuery(
    and(
      eq(occurrences.unitId, unit.id),
      scopedTo(occurrences.accountId, user),
      opts.concernId ? eq(occurrences.concernId, opts.concernId) : undefined,
      after
        ? or(lt(occurrences.occurredAt, String(afterAt)), and(eq(occurrences.occurredAt, String(afterAt)), lt(occurrences.id, String(afterId))))
        : undefined,
    ),
  )
    .orderBy(desc(occurrences.occurredAt), desc(occurrences.id))
    .limit(opts.limit + 1);
  const { page, nextCursor } = paginate(rows, opts.limit, (r) => [r.occurredAt, r.id]);
  const photoOf = await photosOfOccurrences(page.map((r) => r.id));
  const concernRows = await unitIntermittentConcerns(unit.id);
  return {
    unit: { id: unit.id, unitNumber: unit.unitNumber },
    occurrences: page.map((r) => occurrenceJson(r, user, photoOf.get(r.id) ?? null)),
    nextCursor,
    concerns: concernRows,
  };
}

/** Which open intermittent concern a new entry belongs to: the one named, or the unit's only one. */
async function resolveConcern(tx: Tx, unitId: string, concernId: string | null) {
  if (concernId) {
    const [c] = await tx.select(concernColumns).from(concerns).where(and(eq(concerns.id, concernId), eq(concerns.unitId, unitId))).limit(1);
    if (!c || !c.intermittent) throw invalidInput([{ path: "concernId", message: "That is not an intermittent concern on this unit." }]);
    if (c.closedAt) {
      throw invalidInput([{ path: "concernId", message: "The shop has closed that concern. If it is happening again, call the shop." }]);
    }
    return c;
  }
  const open = await tx
    .select(concernColumns)
    .from(concerns)
    .where(and(eq(concerns.unitId, unitId), eq(concerns.intermittent, true), isNull(concerns.closedAt)));
  if (open.length > 1) {
    throw invalidInput([{ path: "concernId", message: `This unit has ${open.length} open intermittent concerns: say which one (concernId).` }]);
  }
  // No open concern: the entry stays on the unit until the shop marks one intermittent.
  return open[0] ?? null;
}

export async function addOccurrence(user: SessionUser, unitId: string, input: OccurrenceInput, notify?: InSameTx<{ id: string }>) {
  return writeTxThen(async (tx) => {
    const unit = await findScopedUnit(user, unitId, tx);
    if (!unit) throw notFound("That unit");
    const concern = await resolveConcern(tx, unit.id, input.concernId);
    const { concernId: _ignored, photoId, ...values } = input;
    const [row] = await tx
      .insert(occurrences)
      .values({ ...values, unitId: unit.id, accountId: unit.accountId, concernId: concern?.id ?? null, createdBy: user.id })
      .returning({ id: occurrences.id });
    if (photoId) await attachOccurrencePhoto(tx, user, { id: row!.id, unitId: unit.id, accountId: unit.accountId }, photoId);
    await recordAudit(tx, user, { action: "occurrence.logged", entityType: "occurrence", entityId: row!.id, accountId: unit.accountId, detail: { unitId: unit.id, concernId: concern?.id ?? null, photoId } });
    return { id: row!.id, unit, concern };
  }, notify);
}

export async function getOccurrence(user: SessionUser, unitId: string, occurrenceId: string) {
  const [row] = await occurrenceQuery(and(eq(occurrences.id, occurrenceId), eq(occurrences.unitId, unitId), scopedTo(occurrences.accountId, user))).limit(1);
  if (!row) return null;
  const photo = (await photosOfOccurrences([row.id])).get(row.id) ?? null;
  return occurrenceJson(row, user, photo);
}

/** Only the person who logged an entry, or the shop, may change it. */
export async function updateOccurrence(user: SessionUser, unitId: string, occurrenceId: string, patch: OccurrencePatch) {
  await writeTx(async (tx) => {
    const [row] = await tx
      .select({ id: occurrences.id, accountId: occurrences.accountId, createdBy: occurrences.createdBy, symptom: occurrences.symptom, symptomText: occurrences.symptomText })
      .from(occurrences)
      .where(and(eq(occurrences.id, occurrenceId), eq(occurrences.unitId, unitId), scopedTo(occurrences.accountId, user)))
      .limit(1);
    if (!row) throw notFound("That entry");
    if (!isStaff(user) && row.createdBy !== user.id) {
      throw forbidden("Only the person who logged this entry, or the shop, may change it.");
    }
    const symptom = patch.symptom ?? row.symptom;
    const symptomText = patch.symptomText ?? row.symptomText;
    if (symptom === "other" && !symptomText) throw invalidInput([{ path: "symptomText", message: "Say in a few words what it did." }]);
    const { photoId, ...fields } = patch;
    if (photoId !== undefined) {
      // The new photo is checked first: a refused one leaves the entry's photo as it was.
      if (photoId) await attachOccurrencePhoto(tx, user, { id: row.id, unitId, accountId: row.accountId }, photoId);
      await detachOccurrencePhotos(tx, row.id, photoId);
    }
    await tx.update(occurrences).set({ ...fields, updatedAt: nowIso() }).where(eq(occurrences.id, row.id));
    await recordAudit(tx, user, { action: "occurrence.edited", entityType: "occurrence", entityId: row.id, accountId: row.accountId, detail: { fields: Object.keys(patch) } });
  });
  return getOccurrence(user, unitId, occurrenceId);
}
