import { and, asc, eq, ne, sql } from "drizzle-orm";
import { getDb, writeTx, type InSameTx, type Tx } from "@/db/client";
import { accounts, concerns, counters, serviceRequestDefects, serviceRequests, statusEvents, units, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { STATUS_LABELS, isShopRole, workOrderLabel } from "@/lib/domain";
import { formatDateTime, shortTitle } from "@/lib/format";
import { HttpError, conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { defectComplaint } from "@/lib/service-requests";
import type { CheckInInput } from "@/lib/validation/visit";
import { workOrderOut } from "@/lib/records/work-order";
import { recordAudit } from "./audit";
import { copyDeferredLines } from "./estimate-lines";
import { recordFormReading } from "./meters";

/** The 409 for a unit already in the shop, with the way to its open visit. */
export function unitInShop(unitNumber: string, open: { id: string; number: number; status: keyof typeof STATUS_LABELS }): HttpError {
  return conflict("unit_in_shop", `${unitNumber} is already in the shop on ${workOrderLabel(open.number)} (${STATUS_LABELS[open.status]}). Add to that visit instead: one open work order per unit.`, {
    workOrderId: open.id,
    workOrderNumber: open.number,
    href: `/work-orders/${open.id}`,
  });
}

async function openVisit(db: Pick<Tx, "select">, unitId: string) {
  const [row] = await db
    .select({ id: workOrders.id, number: workOrders.number, status: workOrders.status })
    .from(workOrders)
    .where(and(eq(workOrders.unitId, unitId), ne(workOrders.status, "released")))
    .limit(1);
  return row ?? null;
}

/** A technician (or any shop staff: in a small shop the owner wrenches too) who still signs in. */
async function assignable(tx: Tx, userId: string) {
  const [tech] = await tx.select({ id: users.id, name: users.name, role: users.role, active: users.active }).from(users).where(eq(users.id, userId)).limit(1);
  if (!tech || !tech.active || !isShopRole(tech.role)) return null;
  return tech;
}

/**
 * Check-in: opens a work order on a unit with its complaints, readings,
 * technician, promised-by time, PO number and any deferred work brought back;
 * a defect report checked in this way becomes the visit's concerns (its
 * defects, unless the writer sent their own wording) and is marked scheduled. One open work order per unit: the check below runs inside
 * the write transaction, and the partial unique index
 * work_orders_one_open_per_unit backs it across processes.
 */
export async function checkIn(user: SessionUser, input: CheckInInput, notify?: InSameTx<{ id: string; serviceRequestId: string | null }>) {
  try {
    return await writeTx(async (tx) => {
      const [unit] = await tx
        .select({ id: units.id, unitNumber: units.unitNumber, accountId: units.accountId, retiredAt: units.retiredAt, archivedAt: accounts.archivedAt })
        .from(units)
        .innerJoin(accounts, eq(accounts.id, units.accountId))
        .where(eq(units.id, input.unitId))
        .limit(1);
      if (!unit) throw notFound("That unit");
      if (unit.retiredAt) throw conflict("unit_retired", `${unit.unitNumber} is retired. Put it back in service on its page to check it in.`);
      if (unit.archivedAt) throw conflict("account_archived", "This unit's account is archived; bring the account back to check its units in.");
      const open = await openVisit(tx, unit.id);
      if (open) throw unitInShop(unit.unitNumber, open);

      const tech = input.assignedTechId ? await assignable(tx, input.assignedTechId) : null;
      if (input.assignedTechId && !tech) throw invalidInput([{ path: "assignedTechId", message: "Choose someone on the shop's staff who still signs in." }]);

      const complaints = input.concerns.map((c) => c.complaint);
      let request: { id: string } | null = null;
      if (input.serviceRequestId) {
        const [sr] = await tx.select().from(serviceRequests).where(eq(serviceRequests.id, input.serviceRequestId)).limit(1);
        if (!sr || sr.unitId !== unit.id) throw invalidInput([{ path: "serviceRequestId", message: "That defect report is not for this unit." }]);
        if (sr.status !== "open") throw conflict("report_scheduled", "That defect report is already on a visit.");
        // Complaints sent with the report are the writer's own wording of it; without any, its defects are the concerns.
        if (complaints.length === 0) {
          const defects = await tx.select().from(serviceRequestDefects).where(eq(serviceRequestDefects.requestId, sr.id)).orderBy(asc(serviceRequestDefects.position));
          complaints.push(...defects.map((d) => defectComplaint(d, sr.reporterName)));
        }
        request = sr;
      }
      if (complaints.length === 0) throw invalidInput([{ path: "concerns", message: "Write at least one complaint: what the unit came in for." }]);

      const [counter] = await tx.update(counters).set({ value: sql`${counters.value} + 1` }).where(eq(counters.name, "work_order")).returning({ value: counters.value });
      if (!counter) throw new Error("the work-order counter is missing");
      const at = nowIso();
      const [wo] = await tx
        .insert(workOrders)
        .values({
          number: counter.value,
          unitId: unit.id,
          accountId: unit.accountId,
          status: "checked_in",
          title: input.title ?? shortTitle(complaints[0]!),
          assignedTechId: tech?.id ?? null,
          promisedAt: input.promisedAt ?? null,
          poNumber: input.poNumber ?? null,
          openedAt: at,
          createdBy: user.id,
        })
        .returning();
      await tx.insert(concerns).values(complaints.map((complaint, position) => ({ unitId: unit.id, workOrderId: wo!.id, position, complaint, createdBy: user.id })));
      const at0 = { unitId: unit.id, workOrderId: wo!.id, note: "At check-in" };
      if (input.odometer !== undefined) await recordFormReading(tx, user, { ...at0, kind: "odometer", value: input.odometer, field: "odometer" });
      if (input.engineHours !== undefined) await recordFormReading(tx, user, { ...at0, kind: "engine_hours", value: input.engineHours, field: "engineHours" });
      await copyDeferredLines(tx, user, wo!, input.bringBackLineIds, 0);
      const note = [
        `Checked in for ${complaints.length === 1 ? "one concern" : `${complaints.length} concerns`}`,
        tech ? `${tech.name} assigned` : null,
        input.promisedAt ? `promised by ${formatDateTime(input.promisedAt)}` : null,
      ].filter(Boolean).join("; ");
      await tx.insert(statusEvents).values({ workOrderId: wo!.id, status: "checked_in", note: `${note}.`, byUserId: user.id, at });
      if (request) {
        await tx.update(serviceRequests).set({ status: "scheduled", workOrderId: wo!.id, scheduledAt: at, updatedAt: at }).where(eq(serviceRequests.id, request.id));
      }
      await recordAudit(tx, user, {
        action: "work_order.checked_in",
        entityType: "work_order",
        entityId: wo!.id,
        accountId: unit.accountId,
        detail: { number: wo!.number, unit: unit.unitNumber, concerns: complaints.length, serviceRequestId: request?.id ?? null },
      });
      // The work order's one shape and what check-in adds to it; internal columns stay inside.
      const checkedIn = {
        ...workOrderOut(wo!),
        assignedTechId: wo!.assignedTechId,
        poNumber: wo!.poNumber,
        openedAt: wo!.openedAt,
        concerns: complaints.map((complaint) => ({ complaint })),
        serviceRequestId: request?.id ?? null,
      };
      await notify?.(tx, checkedIn);
      return checkedIn;
    });
  } catch (error) {
    // Another process committed an open visit between our check and our insert.
    if (error instanceof Error && /UNIQUE constraint failed: work_orders\.unit_id/.test(`${error.message} ${String(error.cause ?? "")}`)) {
      const open = await openVisit(getDb(), input.unitId);
      const [unit] = await getDb().select({ unitNumber: units.unitNumber }).from(units).where(eq(units.id, input.unitId)).limit(1);
      if (open && unit) throw unitInShop(unit.unitNumber, open);
    }
    throw error;
  }
}
