import { aliasedTable, and, asc, desc, eq, getTableColumns, gt, isNotNull, isNull, lt, ne, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accounts, estimateLines, meterReadings, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invalidInput } from "@/lib/http/problem";
import { decodeCursor, paginate, type PageQuery } from "@/lib/http/pagination";
import { isDeferredLine } from "./estimate-lines";
import { scopedTo } from "./scope";

const openWo = aliasedTable(workOrders, "open_wo");

/**
 * A search as FTS5 trigram terms: each word of 3+ characters must appear
 * somewhere in the unit's number, VIN, serial, plate, description or account
 * name (any 4+ characters of a VIN, anywhere in it, among them). Words of one
 * or two characters are too short for a trigram and match the start of the
 * unit number instead.
 */
export function searchTerms(q: string | undefined): { match: string | null; prefixes: string[] } {
  const words = (q ?? "").split(/\s+/).filter(Boolean).slice(0, 8);
  const long = words.filter((w) => w.length >= 3);
  return { match: long.length ? long.map((w) => `"${w.replace(/"/g, '""')}"`).join(" ") : null, prefixes: words.filter((w) => w.length < 3) };
}

export interface UnitListOptions extends PageQuery {
  inShop?: boolean;
  retired?: boolean;
  q?: string;
  accountId?: string;
}

export async function listUnits(user: SessionUser, opts: UnitListOptions) {
  const after = decodeCursor(opts.cursor, 2);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
  const [afterNumber, afterId] = after ?? [];
  const { match, prefixes } = searchTerms(opts.q);

  const rows = await getDb()
    .select({
      id: units.id,
      unitNumber: units.unitNumber,
      vin: units.vin,
      serialNumber: units.serialNumber,
      year: units.year,
      plate: units.plate,
      description: units.description,
      accountId: units.accountId,
      accountName: accounts.name,
      retiredAt: units.retiredAt,
      unitUpdatedAt: units.updatedAt,
      workOrderId: openWo.id,
      workOrderNumber: openWo.number,
      openStatus: openWo.status,
      workOrderUpdatedAt: openWo.updatedAt,
      hasHistory: sql<number>`exists (select 1 from work_orders w where w.unit_id = ${units.id})`,
    })
    .from(units)
    .innerJoin(accounts, eq(accounts.id, units.accountId))
    .leftJoin(openWo, and(eq(openWo.unitId, units.id), ne(openWo.status, "released")))
    .where(
      and(
        scopedTo(units.accountId, user),
        opts.accountId ? eq(units.accountId, opts.accountId) : undefined,
        opts.retired ? isNotNull(units.retiredAt) : isNull(units.retiredAt),
        opts.inShop ? isNotNull(openWo.id) : undefined,
        match ? sql`${units.id} in (select unit_id from unit_search where unit_search match ${match})` : undefined,
        ...prefixes.map((p) => sql`upper(${units.unitNumber}) like ${`${p.toUpperCase().replace(/[%_\\]/g, "\\$&")}%`} escape '\\'`),
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
      serialNumber: r.serialNumber,
      year: r.year,
      plate: r.plate,
      description: r.description,
      accountId: r.accountId,
      accountName: r.accountName,
      retired: r.retiredAt !== null,
      // A unit out of the shop reads as its last visit's state: released.
      status: r.openStatus ?? (r.hasHistory ? "released" : null),
      workOrderId: r.workOrderId,
      workOrderNumber: r.workOrderNumber,
      updatedAt: maxIso(r.unitUpdatedAt, r.workOrderUpdatedAt),
    })),
    nextCursor,
  };
}

export type UnitListItem = Awaited<ReturnType<typeof listUnits>>["units"][number];

function maxIso(a: string, b: string | null): string {
  return b && b > a ? b : a;
}

/**
 * One unit with its readings, visits and deferred work. Pages pass `visits` and
 * get one page of visits, newest first, with the cursor of the next (the open
 * visit is read on its own); without it every visit comes back (GET /api/v1/units/:id).
 */
export async function getUnitDetail(user: SessionUser, id: string, opts: { visits?: PageQuery } = {}) {
  const db = getDb();
  const after = opts.visits ? decodeCursor(opts.visits.cursor, 2) : null;
  if (opts.visits?.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);
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
      inspectionBasis: units.inspectionBasis,
      inspectionDueOn: units.inspectionDueOn,
      keyOffDrainLimitMa: units.keyOffDrainLimitMa,
      retiredAt: units.retiredAt,
      updatedAt: units.updatedAt,
    })
    .from(units)
    .innerJoin(accounts, eq(accounts.id, units.accountId))
    .where(and(eq(units.id, id), scopedTo(units.accountId, user)))
    .limit(1);
  if (!unit) return null;

  const [readings, visitRows, [openRow]] = await Promise.all([
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
      .where(
        and(
          eq(workOrders.unitId, id),
          after
            ? or(lt(workOrders.openedAt, String(after[0])), and(eq(workOrders.openedAt, String(after[0])), lt(workOrders.id, String(after[1]))))
            : undefined,
        ),
      )
      .orderBy(desc(workOrders.openedAt), desc(workOrders.id))
      .limit(opts.visits ? opts.visits.limit + 1 : -1),
    // At most one open visit per unit (work_orders_one_open_per_unit): read on its own, whatever page is shown.
    db
      .select({ id: workOrders.id, number: workOrders.number, status: workOrders.status, title: workOrders.title })
      .from(workOrders)
      .where(and(eq(workOrders.unitId, id), sql`${workOrders.status} <> 'released'`))
      .limit(1),
  ]);
  const { page: history, nextCursor } = opts.visits
    ? paginate(visitRows, opts.visits.limit, (r) => [r.openedAt, r.id])
    : { page: visitRows, nextCursor: null };

  // Every column: the API answers each deferred line in the one estimate-line shape.
  const deferred = await db
    .select(getTableColumns(estimateLines))
    .from(estimateLines)
    .innerJoin(workOrders, eq(workOrders.id, estimateLines.workOrderId))
    .where(
      and(
        eq(workOrders.unitId, id),
        isDeferredLine,
      ),
    )
    .orderBy(desc(estimateLines.updatedAt));

  return { unit, openWorkOrder: openRow ?? null, readings, history, historyNextCursor: nextCursor, deferred };
}
