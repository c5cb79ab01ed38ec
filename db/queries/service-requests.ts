import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { getDb, writeTx, type InSameTx } from "@/db/client";
import { accounts, photos, serviceRequestDefects, serviceRequests, units, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel, type ServiceRequestStatus } from "@/lib/domain";
import { conflict, invalidInput, notFound } from "@/lib/http/problem";
import { decodeCursor, paginate, type PageQuery } from "@/lib/http/pagination";
import { photoUrls } from "@/lib/uploads/photo-urls";
import type { ServiceRequestInput } from "@/lib/validation/service-request";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

/**
 * Files a defect report on one of the caller's units (the shop may file one
 * too). The photo, if any, is the reporter's own fresh upload for this unit.
 */
export async function createServiceRequest(user: SessionUser, unitId: string, input: ServiceRequestInput, notify?: InSameTx<{ id: string }>) {
  return writeTx(async (tx) => {
    const [unit] = await tx
      .select({ id: units.id, accountId: units.accountId, unitNumber: units.unitNumber, retiredAt: units.retiredAt })
      .from(units)
      .where(and(eq(units.id, unitId), scopedTo(units.accountId, user)))
      .limit(1);
    if (!unit) throw notFound("That unit");
    if (unit.retiredAt) throw conflict("unit_retired", `${unit.unitNumber} is retired.`);
    const [row] = await tx
      .insert(serviceRequests)
      .values({ accountId: unit.accountId, unitId: unit.id, reportedBy: user.id, reporterName: user.name, odometer: input.odometer ?? null, engineHours: input.engineHours ?? null, note: input.note })
      .returning();
    await tx.insert(serviceRequestDefects).values(input.defects.map((d, position) => ({ requestId: row!.id, position, ...d })));
    if (input.photoId) {
      const attached = await tx
        .update(photos)
        .set({ serviceRequestId: row!.id })
        .where(
          and(
            eq(photos.id, input.photoId),
            eq(photos.unitId, unit.id),
            eq(photos.uploadedBy, user.id),
            isNull(photos.serviceRequestId),
            isNull(photos.occurrenceId),
            isNull(photos.findingId),
            isNull(photos.workOrderId),
          ),
        )
        .returning({ id: photos.id });
      if (!attached.length) throw invalidInput([{ path: "photoId", message: "That photo cannot go on this report: it is not a new photo you added for this unit. Take or choose it again." }]);
    }
    await recordAudit(tx, user, { action: "service_request.filed", entityType: "service_request", entityId: row!.id, accountId: unit.accountId, detail: { unit: unit.unitNumber, defects: input.defects.length } });
    await notify?.(tx, row!);
    return row!;
  });
}

export interface ServiceRequestListOptions extends PageQuery {
  status?: ServiceRequestStatus;
  unitId?: string;
}

/** Defect reports the caller may see, newest first: the shop every account's, a fleet person their account's. */
export async function listServiceRequests(user: SessionUser, opts: ServiceRequestListOptions) {
  const after = decodeCursor(opts.cursor, 2);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
  const db = getDb();
  const rows = await db
    .select({
      id: serviceRequests.id,
      accountId: serviceRequests.accountId,
      accountName: accounts.name,
      unitId: serviceRequests.unitId,
      unitNumber: units.unitNumber,
      unitDescription: units.description,
      status: serviceRequests.status,
      reporterName: serviceRequests.reporterName,
      odometer: serviceRequests.odometer,
      engineHours: serviceRequests.engineHours,
      note: serviceRequests.note,
      workOrderId: serviceRequests.workOrderId,
      workOrderNumber: workOrders.number,
      createdAt: serviceRequests.createdAt,
      scheduledAt: serviceRequests.scheduledAt,
      closedAt: serviceRequests.closedAt,
    })
    .from(serviceRequests)
    .innerJoin(accounts, eq(accounts.id, serviceRequests.accountId))
    .innerJoin(units, eq(units.id, serviceRequests.unitId))
    .leftJoin(workOrders, eq(workOrders.id, serviceRequests.workOrderId))
    .where(
      and(
        scopedTo(serviceRequests.accountId, user),
        opts.status ? eq(serviceRequests.status, opts.status) : undefined,
        opts.unitId ? eq(serviceRequests.unitId, opts.unitId) : undefined,
        after ? sql`(${serviceRequests.createdAt}, ${serviceRequests.id}) < (${String(after[0])}, ${String(after[1])})` : undefined,
      ),
    )
    .orderBy(desc(serviceRequests.createdAt), desc(serviceRequests.id))
    .limit(opts.limit + 1);
  const { page, nextCursor } = paginate(rows, opts.limit, (r) => [r.createdAt, r.id]);
  const ids = page.map((r) => r.id);
  const [defects, pics] = ids.length
    ? await Promise.all([
        db.select().from(serviceRequestDefects).where(inArray(serviceRequestDefects.requestId, ids)).orderBy(asc(serviceRequestDefects.position)),
        db.select({ id: photos.id, requestId: photos.serviceRequestId }).from(photos).where(inArray(photos.serviceRequestId, ids)),
      ])
    : [[], []];
  return {
    serviceRequests: page.map((r) => ({
      ...r,
      workOrderLabel: r.workOrderNumber ? workOrderLabel(r.workOrderNumber) : null,
      outOfService: defects.some((d) => d.requestId === r.id && d.outOfService),
      defects: defects.filter((d) => d.requestId === r.id).map((d) => ({ area: d.area, description: d.description, outOfService: d.outOfService })),
      photos: pics.filter((p) => p.requestId === r.id).map((p) => photoUrls(p.id)),
    })),
    nextCursor,
  };
}

export type ServiceRequestItem = Awaited<ReturnType<typeof listServiceRequests>>["serviceRequests"][number];

/** One report, scoped (the check-in page starts from it). */
export async function getServiceRequest(user: SessionUser, id: string) {
  const [row] = await getDb()
    .select({ id: serviceRequests.id, unitId: serviceRequests.unitId, status: serviceRequests.status, odometer: serviceRequests.odometer, engineHours: serviceRequests.engineHours, reporterName: serviceRequests.reporterName, note: serviceRequests.note, createdAt: serviceRequests.createdAt })
    .from(serviceRequests)
    .where(and(eq(serviceRequests.id, id), scopedTo(serviceRequests.accountId, user)))
    .limit(1);
  if (!row) return null;
  const defects = await getDb().select().from(serviceRequestDefects).where(eq(serviceRequestDefects.requestId, id)).orderBy(asc(serviceRequestDefects.position));
  return { ...row, defects };
}
