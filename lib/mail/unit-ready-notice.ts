import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accountRecipients } from "@/db/queries/recipients";
import { shopSettings, units, workOrders } from "@/db/schema";
import { workOrderLabel } from "@/lib/domain";
import { appUrl, sendMail } from "./send";
import { unitReadyMail } from "./templates/unit-ready";

/** Tells the unit's account (approvers and viewers) that it can be picked up. */
export async function sendUnitReadyNotice(workOrderId: string, note: string): Promise<{ sent: number; failed: number }> {
  const db = getDb();
  const [row] = await db
    .select({ number: workOrders.number, accountId: workOrders.accountId, unitId: units.id, unitNumber: units.unitNumber, unitDescription: units.description })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(eq(workOrders.id, workOrderId))
    .limit(1);
  if (!row) return { sent: 0, failed: 0 };
  const [settings] = await db.select({ shopName: shopSettings.shopName }).from(shopSettings).limit(1);
  const to = await accountRecipients(row.accountId, ["approver", "viewer"]);
  const mail = unitReadyMail({
    shopName: settings?.shopName ?? "The shop",
    unitNumber: row.unitNumber,
    unitDescription: row.unitDescription,
    workOrderLabel: workOrderLabel(row.number),
    note,
    url: appUrl(`/fleet/units/${row.unitId}`),
  });
  return sendMail(to, mail, "unit-ready");
}
