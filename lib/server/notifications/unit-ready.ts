import "server-only";
import { eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { accountRecipients } from "@/db/queries/recipients";
import { shopSettings, units, workOrders } from "@/db/schema";
import { workOrderLabel } from "@/lib/domain";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { unitReadyMail } from "@/lib/mail/templates/unit-ready";

/** Queues, in the status move's transaction, the e-mail telling the account (approvers and viewers) it can be picked up. */
export async function queueUnitReadyNotice(tx: Tx, workOrderId: string, note: string): Promise<void> {
  const [row] = await tx
    .select({ number: workOrders.number, accountId: workOrders.accountId, unitId: units.id, unitNumber: units.unitNumber, unitDescription: units.description })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(eq(workOrders.id, workOrderId))
    .limit(1);
  if (!row) return;
  const [settings] = await tx.select({ shopName: shopSettings.shopName }).from(shopSettings).limit(1);
  const to = await accountRecipients(row.accountId, ["approver", "viewer"], tx);
  const mail = unitReadyMail({
    shopName: settings?.shopName ?? "The shop",
    unitNumber: row.unitNumber,
    unitDescription: row.unitDescription,
    workOrderLabel: workOrderLabel(row.number),
    note,
    url: appUrl(`/fleet/units/${row.unitId}`),
  });
  await queueMail(tx, { to, template: "unit-ready", mail });
}
