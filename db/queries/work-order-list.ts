import { and, count, desc, eq, gte, inArray, lt, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accounts, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { OPEN_STATUSES, type WorkOrderStatus } from "@/lib/domain";
import { invalidInput } from "@/lib/http/problem";
import { addDays, startOfDayIso } from "@/lib/dates";
import { env } from "@/lib/env";
import { decodeCursor, PAGE_SIZE, paginate, type PageQuery } from "@/lib/http/pagination";
import { workOrderOut } from "@/lib/records/work-order";
import { scopedTo } from "./scope";
import { clockedTechNameSql } from "./time-clock";

export interface WorkOrderListItem {
  id: string;
  number: number;
  label: string;
  unitId: string;
  accountId: string;
  status: WorkOrderStatus;
  promisedAt: string | null;
  openedAt: string;
  releasedAt: string | null;
  updatedAt: string;
  title: string;
  unitNumber: string;
  unitDescription: string;
  accountName: string;
  technicianId: string | null;
  technicianName: string | null;
  /** With no technician assigned: who has clocked time on the visit. */
  clockedTechName: string | null;
  lastNote: string;
  /** A posted finding on this visit is Out of service: shown first and marked on every list. */
  outOfService: boolean;
}

export interface WorkOrderFilters {
  status?: WorkOrderStatus;
  technicianId?: string;
  accountId?: string;
  /** Past visits too (released ones), not only those open now. */
  all?: boolean;
  /** Opened on or after / on or before these calendar dates, in the shop's time zone. */
  openedFrom?: string;
  openedTo?: string;
}

// A literal, not a bound parameter: only then can SQLite use the partial indexes on open work
// (work_orders_open_*), so the list reads the open visits and never walks the released ones.
const stillOpen = sql`${workOrders.status} <> 'released'`;

/**
 * Work orders the caller may see, newest number first: by default the open
 * ones (the Floor, the fleet's "in the shop" list, GET /api/v1/work-orders);
 * with `all`, past visits too, for the shop's work-order list.
 */
export async function listOpenWorkOrders(
  user: SessionUser,
  opts: PageQuery & WorkOrderFilters,
): Promise<{ workOrders: WorkOrderListItem[]; nextCursor: string | null }> {
  const zone = env().APP_TIME_ZONE;
  const after = decodeCursor(opts.cursor, 1);
  if (opts.cursor && !after) throw invalidInput([{ path: "cursor", message: "Not a cursor this API issued." }]);

  const rows = await getDb()
    .select({
      id: workOrders.id,
      number: workOrders.number,
      unitId: workOrders.unitId,
      accountId: workOrders.accountId,
      status: workOrders.status,
      promisedAt: workOrders.promisedAt,
      openedAt: workOrders.openedAt,
      releasedAt: workOrders.releasedAt,
      updatedAt: workOrders.updatedAt,
      title: workOrders.title,
      unitNumber: units.unitNumber,
      unitDescription: units.description,
      accountName: accounts.name,
      technicianId: workOrders.assignedTechId,
      technicianName: users.name,
      clockedTechName: clockedTechNameSql(),
      lastNote: sql<string>`coalesce((select e.note from status_events e where e.work_order_id = ${workOrders.id} order by e.at desc limit 1), '')`,
      outOfService: sql<number>`exists (select 1 from findings f where f.work_order_id = ${workOrders.id} and f.severity = 'out_of_service')`,
    })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .innerJoin(accounts, eq(accounts.id, workOrders.accountId))
    .leftJoin(users, eq(users.id, workOrders.assignedTechId))
    .where(
      and(
        scopedTo(workOrders.accountId, user),
        opts.status ? eq(workOrders.status, opts.status) : opts.all ? undefined : stillOpen,
        opts.technicianId ? eq(workOrders.assignedTechId, opts.technicianId) : undefined,
        opts.accountId ? eq(workOrders.accountId, opts.accountId) : undefined,
        opts.openedFrom ? gte(workOrders.openedAt, startOfDayIso(opts.openedFrom, zone)) : undefined,
        opts.openedTo ? lt(workOrders.openedAt, startOfDayIso(addDays(opts.openedTo, 1), zone)) : undefined,
        after ? lt(workOrders.number, Number(after[0])) : undefined,
      ),
    )
    .orderBy(desc(workOrders.number))
    .limit(opts.limit + 1);

  const { page, nextCursor } = paginate(rows, opts.limit, (r) => [r.number]);
  return {
    workOrders: page.map((r) => ({ ...r, ...workOrderOut(r), outOfService: Boolean(r.outOfService) })),
    nextCursor,
  };
}

/** What a card on the Floor shows of a work order. */
export type FloorCard = Pick<
  WorkOrderListItem,
  "id" | "label" | "status" | "unitNumber" | "unitDescription" | "accountName" | "title" | "promisedAt" | "technicianName" | "clockedTechName" | "lastNote" | "outOfService"
>;

function floorCard(w: WorkOrderListItem): FloorCard {
  return {
    id: w.id,
    label: w.label,
    status: w.status,
    unitNumber: w.unitNumber,
    unitDescription: w.unitDescription,
    accountName: w.accountName,
    title: w.title,
    promisedAt: w.promisedAt,
    technicianName: w.technicianName,
    clockedTechName: w.clockedTechName,
    lastNote: w.lastNote,
    outOfService: w.outOfService,
  };
}

export interface FloorLane {
  status: WorkOrderStatus;
  /** The newest PAGE_SIZE of the lane; `total` says how many more the full list holds. */
  workOrders: FloorCard[];
  total: number;
}

/**
 * The Floor: each open status's newest page of work orders and how many it holds, and for a
 * technician their own open work. Only open visits are read, through the partial indexes,
 * so the board costs the same after years of released ones.
 */
export async function floorLanes(user: SessionUser, opts: { mineFor?: string } = {}) {
  const [lanes, counts, mine] = await Promise.all([
    Promise.all(OPEN_STATUSES.map((status) => listOpenWorkOrders(user, { status, limit: PAGE_SIZE }))),
    getDb()
      .select({ status: workOrders.status, n: count() })
      .from(workOrders)
      // Each open status by name, an index seek apiece: "not released" walked every visit ever made.
      .where(and(scopedTo(workOrders.accountId, user), inArray(workOrders.status, [...OPEN_STATUSES])))
      .groupBy(workOrders.status),
    opts.mineFor ? listOpenWorkOrders(user, { technicianId: opts.mineFor, limit: PAGE_SIZE }) : null,
  ]);
  const totalOf = new Map(counts.map((c) => [c.status, c.n]));
  return {
    lanes: OPEN_STATUSES.map((status, i): FloorLane => ({ status, workOrders: lanes[i]!.workOrders.map(floorCard), total: totalOf.get(status) ?? 0 })),
    total: counts.reduce((sum, c) => sum + c.n, 0),
    mine: mine ? { workOrders: mine.workOrders.map(floorCard), more: mine.nextCursor !== null } : null,
  };
}

export type FloorData = Awaited<ReturnType<typeof floorLanes>>;
