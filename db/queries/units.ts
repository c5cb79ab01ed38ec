import { aliasedTable, and, asc, desc, eq, gt, inArray, isNotNull, ne, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accounts, estimateLines, meterReadings, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invalidInput } from "@/lib/http/problem";
import { decodeCursor, paginate, type PageQuery } from "@/lib/http/pagination";
import { scopedTo } from "./scope";

const openWo = aliasedTable(workOrders, "open_wo");

export async function listUnits(user: SessionUser, opts: PageQuery & { inShop?: boolean }) {
  const after = decodeCursor(opts.cursor, 2);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
  const [afterNumber, afterId] = after ?? [];

  const rows = await getDb()
    .select({
      id: units.id,
      unitNumber: units.unitNumber,
      vin: units.vin,
      description: units.description,
      accountId: units.accountId,
      unitUpdatedAt: units.updatedAt,
      workOrderId: openWo.id,
      openStatus: openWo.status,
      workOrderUpdatedAt: openWo.updatedAt,
      hasHistory: sql<number>`exists (select 1 from work_orders w where w.unit_id = ${units.id})`,
    })
    .from(units)
    .leftJoin(openWo, and(eq(openWo.unitId, units.id), ne(openWo.status, "released")))
    .where(
      and(
        scopedTo(units.accountId, user),
        opts.inShop ? isNotNull(openWo.id) : undefined,
        after
          ? or(
              gt(units.unitNumber, String(afterNumber)),
              and(eq(units.unitNumber, String(afterNumber)), gt(units.id, String(afterId))),
            )
          : undefined,
      ),
    )
    .orderBy(asc(units.unitNumber), asc(units.id))
    .limit(opts.limit + 1);

  const { page, nextCursor } = paginate(rows, opts.limit, (r) => [r.unitNumber, r.id]);
  return {
    units: page.map((r) => ({
      id: r.id,
      unitNumber: r.unitNumber,
      vin: r.vin,
      description: r.description,
      accountId: r.accountId,
      // A unit out of the shop reads as its last visit's state: released.
      status: r.openStatus ?? (r.hasHistory ? "released" : null),
      workOrderId: r.workOrderId,
      updatedAt: maxIso(r.unitUpdatedAt, r.workOrderUpdatedAt),
    })),
    nextCursor,
  };
}

function maxIso(a: string, b: string | null): string {
  return b && b > a ? b : a;
}

export async function getUnitDetail(user: SessionUser, id: string) {
  const db = getDb();
  const [unit] = await db
    .select({
      id: units.id,
      unitNumber: units.unitNumber,
      vin: units.vin,
      serialOnly: units.serialOnly,
      serialNumber: units.serialNumber,
      year: units.year,
      description: units.description,
      plate: units.plate,
      accountId: units.accountId,
      accountName: accounts.name,
      lastInspectionOn: units.lastInspectionOn,
      inspectionDueOn: units.inspectionDueOn,
      keyOffDrainLimitMa: units.keyOffDrainLimitMa,
      updatedAt: units.updatedAt,
    })
    .from(units)
    .innerJoin(accounts, eq(accounts.id, units.accountId))
    .where(and(eq(units.id, id), scopedTo(units.accountId, user)))
    .limit(1);
  if (!unit) return null;

  const [readings, history] = await Promise.all([
    db
      .select({
        id: meterReadings.id,
        kind: meterReadings.kind,
        value: meterReadings.value,
        meterReplaced: meterReadings.meterReplaced,
        readAt: meterReadings.readAt,
        note: meterReadings.note,
      })
      .from(meterReadings)
      .where(eq(meterReadings.unitId, id))
      .orderBy(desc(meterReadings.readAt)),
    db
      .select({
        id: workOrders.id,
        number: workOrders.number,
        status: workOrders.status,
        title: workOrders.title,
        openedAt: workOrders.openedAt,
        releasedAt: workOrders.releasedAt,
        promisedAt: workOrders.promisedAt,
        updatedAt: workOrders.updatedAt,
        technicianName: users.name,
      })
      .from(workOrders)
      .leftJoin(users, eq(users.id, workOrders.assignedTechId))
      .where(eq(workOrders.unitId, id))
      .orderBy(desc(workOrders.openedAt)),
  ]);

  const deferred = await db
    .select({
      id: estimateLines.id,
      workOrderId: estimateLines.workOrderId,
      kind: estimateLines.kind,
      description: estimateLines.description,
      quantityMilli: estimateLines.quantityMilli,
      unitPriceCents: estimateLines.unitPriceCents,
      state: estimateLines.state,
      updatedAt: estimateLines.updatedAt,
    })
    .from(estimateLines)
    .where(
      and(
        inArray(
          estimateLines.workOrderId,
          history.map((h) => h.id),
        ),
        inArray(estimateLines.state, ["held", "declined"]),
        sql`${estimateLines.broughtBackAt} is null`,
      ),
    )
    .orderBy(desc(estimateLines.updatedAt));

  const open = history.find((h) => h.status !== "released") ?? null;
  return { unit, openWorkOrder: open, readings, history, deferred };
}
