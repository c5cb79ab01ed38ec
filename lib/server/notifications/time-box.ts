import "server-only";
import { inArray } from "drizzle-orm";
import type { Reader, Tx } from "@/db/client";
import { accountRecipients } from "@/db/queries/recipients";
import type { TimeBoxNoticeDue } from "@/db/queries/time-box-stops";
import { workOrderForMail } from "@/db/queries/work-order-detail";
import { users } from "@/db/schema";
import { workOrderLabel } from "@/lib/domain";
import { formatClock, formatTenths } from "@/lib/estimate";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { timeBoxExtensionMail, timeBoxMail } from "@/lib/mail/templates/estimate";
import { writersFor } from "./estimate";

/*
 * Every e-mail about the diagnosis time box is queued here, inside the transaction that made it
 * due (the one that stopped the clock or crossed 80 %), so a notice is kept exactly when the
 * box's "warned" / "reached" mark is.
 */

async function activeEmails(userIds: readonly string[], db: Reader): Promise<string[]> {
  if (!userIds.length) return [];
  const rows = await db.select({ email: users.email, active: users.active }).from(users).where(inArray(users.id, [...userIds]));
  return rows.filter((r) => r.active).map((r) => r.email);
}

/** 80 %: the technicians on the box (their phones) and the writer. 100 %: them, and the fleet's approvers. */
export async function queueTimeBoxNotice(tx: Tx, notice: TimeBoxNoticeDue): Promise<void> {
  const wo = await workOrderForMail(notice.workOrderId, tx);
  const base = {
    kind: notice.kind,
    woLabel: workOrderLabel(wo.number),
    unitNumber: wo.unitNumber,
    description: notice.description,
    used: formatClock(notice.usedMs),
    approved: formatTenths(notice.approvedMilli),
  };
  const template = notice.kind === "warn" ? "time_box_warning" : "time_box_reached";
  const shop = appUrl(`/work-orders/${wo.id}`);
  const techs = await activeEmails([...new Set([...notice.techIds, ...(wo.assignedTechId ? [wo.assignedTechId] : [])])], tx);
  const writers = (await writersFor(wo, tx)).filter((w) => !techs.includes(w));
  await queueMail(tx, { to: techs, template, mail: timeBoxMail({ ...base, url: shop, reader: "tech" }) });
  await queueMail(tx, { to: writers, template, mail: timeBoxMail({ ...base, url: shop, reader: "writer" }) });
  if (notice.kind === "reached") {
    const fleet = await accountRecipients(wo.accountId, ["approver"], tx);
    await queueMail(tx, { to: fleet, template, mail: timeBoxMail({ ...base, url: appUrl(`/fleet/work-orders/${wo.id}`), reader: "fleet" }) });
  }
}

export async function queueTimeBoxNotices(tx: Tx, notices: readonly TimeBoxNoticeDue[]): Promise<void> {
  for (const notice of notices) await queueTimeBoxNotice(tx, notice);
}

export async function queueTimeBoxExtensionRequest(
  tx: Tx,
  p: {
    workOrderId: string;
    description: string;
    moreMilli: number;
    usedMs: number;
    approvedMilli: number;
    amountCents: number;
    note: string;
  },
): Promise<void> {
  const wo = await workOrderForMail(p.workOrderId, tx);
  const mail = timeBoxExtensionMail({
    woLabel: workOrderLabel(wo.number),
    unitNumber: wo.unitNumber,
    description: p.description,
    more: formatTenths(p.moreMilli),
    used: formatClock(p.usedMs),
    approved: formatTenths(p.approvedMilli),
    amountCents: p.amountCents,
    note: p.note,
    url: appUrl(`/fleet/work-orders/${wo.id}`),
  });
  await queueMail(tx, { to: await accountRecipients(wo.accountId, ["approver"], tx), template: "time_box_extension", mail });
}
