import { and, count, eq, inArray, isNull, ne } from "drizzle-orm";
import { getDb, type Reader } from "@/db/client";
import { accounts, concerns, occurrences, units, users, workOrders } from "@/db/schema";
import { shopRecipients } from "./recipients";

/**
 * Who hears about a new occurrence: the writer and the assigned technician of
 * the visit the concern was raised on and of the unit's visit in the shop now.
 * With no writer among them, every active writer.
 */
export async function occurrenceRecipients(unitId: string, concernId: string | null, db: Reader = getDb()): Promise<string[]> {
  const ids = new Set<string>();
  if (concernId) {
    const [c] = await db
      .select({ createdBy: concerns.createdBy, woCreatedBy: workOrders.createdBy, tech: workOrders.assignedTechId })
      .from(concerns)
      .leftJoin(workOrders, eq(workOrders.id, concerns.workOrderId))
      .where(eq(concerns.id, concernId))
      .limit(1);
    for (const id of [c?.createdBy, c?.woCreatedBy, c?.tech]) if (id) ids.add(id);
  }
  const open = await db
    .select({ createdBy: workOrders.createdBy, tech: workOrders.assignedTechId })
    .from(workOrders)
    .where(and(eq(workOrders.unitId, unitId), ne(workOrders.status, "released")));
  for (const wo of open) for (const id of [wo.createdBy, wo.tech]) if (id) ids.add(id);

  const staff = ids.size
    ? await db
        .select({ email: users.email, role: users.role })
        .from(users)
        .where(and(inArray(users.id, [...ids]), isNull(users.accountId), eq(users.active, true)))
    : [];
  const emails = staff.map((s) => s.email);
  if (!staff.some((s) => s.role === "writer" || s.role === "owner")) emails.push(...(await shopRecipients(["writer"], db)));
  return [...new Set(emails)];
}

/** What the e-mail needs: unit, account, concern, and how many entries there are now. */
export async function occurrenceMailFacts(occurrenceId: string, db: Reader = getDb()) {
  const [row] = await db
    .select({
      occurrence: occurrences,
      unitNumber: units.unitNumber,
      accountName: accounts.name,
      complaint: concerns.complaint,
      loggedBy: users.name,
    })
    .from(occurrences)
    .innerJoin(units, eq(units.id, occurrences.unitId))
    .innerJoin(accounts, eq(accounts.id, occurrences.accountId))
    .leftJoin(concerns, eq(concerns.id, occurrences.concernId))
    .leftJoin(users, eq(users.id, occurrences.createdBy))
    .where(eq(occurrences.id, occurrenceId))
    .limit(1);
  if (!row) return null;
  const o = row.occurrence;
  const [n] = await db
    .select({ n: count() })
    .from(occurrences)
    .where(o.concernId ? eq(occurrences.concernId, o.concernId) : and(eq(occurrences.unitId, o.unitId), isNull(occurrences.concernId)));
  return { ...row, count: n?.n ?? 1 };
}
