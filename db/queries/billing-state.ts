import { sql, type SQL } from "drizzle-orm";
import type { Reader } from "@/db/client";
import { workOrders } from "@/db/schema";
import { APPROVED_STATES } from "@/lib/estimate";

const approvedStates = sql.join(
  APPROVED_STATES.map((s) => sql`${s}`),
  sql`, `,
);

/**
 * The truth work_orders.nothing_to_bill caches, for the row being updated: a
 * live (not void) invoice exists, or the visit is released with no approved,
 * started or finished line (a released visit takes no more decisions, so it can
 * never have anything to bill).
 */
const nothingToBillNow = sql`(
  exists (select 1 from invoices i where i.work_order_id = ${workOrders.id} and i.status <> 'void')
  or (${workOrders.status} = 'released'
      and not exists (select 1 from estimate_lines l where l.work_order_id = ${workOrders.id} and l.state in (${approvedStates})))
)`;

/**
 * Sets the flag from the truth for one work order (inside the write that changed
 * its invoices, its lines or its status) or, with no id, for every work order
 * (the migration's back-fill, the seeds, a repair). The invoice queues still
 * check the truth themselves, so a flag left at 0 costs a row read and never
 * hides work; only this function sets it to 1.
 */
export async function settleNothingToBill(tx: Reader, workOrderId?: string): Promise<void> {
  const where: SQL | undefined = workOrderId ? sql`${workOrders.id} = ${workOrderId}` : undefined;
  await tx.update(workOrders).set({ nothingToBill: nothingToBillNow }).where(where);
}
