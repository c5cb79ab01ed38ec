import { inArray } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accountRecipients } from "@/db/queries/recipients";
import type { TimeBoxNoticeDue } from "@/db/queries/time-box-stops";
import { workOrderForMail } from "@/db/queries/work-order-detail";
import { users } from "@/db/schema";
import { workOrderLabel } from "@/lib/domain";
import { formatClock, formatTenths } from "@/lib/estimate";
import { appUrl, sendMail } from "@/lib/mail/send";
import { timeBoxExtensionMail, timeBoxMail } from "@/lib/mail/templates/estimate";
import { writersFor } from "./estimate";

/*
 * Every e-mail about the diagnosis time box goes through the two functions below, which call the
 * one mail path (lib/mail/send.ts), so a change of how mail leaves the app touches only it.
 */

async function activeEmails(userIds: readonly string[]): Promise<string[]> {
  if (!userIds.length) return [];
  const rows = await getDb().select({ email: users.email, active: users.active }).from(users).where(inArray(users.id, [...userIds]));
  return rows.filter((r) => r.active).map((r) => r.email);
}

/** 80 %: the technicians on the box (their phones) and the writer. 100 %: them, and the fleet's approvers. */
export async function sendTimeBoxNotice(notice: TimeBoxNoticeDue): Promise<void> {
  const wo = await workOrderForMail(notice.workOrderId);
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
  const techs = await activeEmails([...new Set([...notice.techIds, ...(wo.assignedTechId ? [wo.assignedTechId] : [])])]);
  const writers = (await writersFor(wo)).filter((w) => !techs.includes(w));
  await sendMail(techs, timeBoxMail({ ...base, url: shop, reader: "tech" }), template);
  await sendMail(writers, timeBoxMail({ ...base, url: shop, reader: "writer" }), template);
  if (notice.kind === "reached") {
    const fleet = await accountRecipients(wo.accountId, ["approver"]);
    await sendMail(fleet, timeBoxMail({ ...base, url: appUrl(`/fleet/work-orders/${wo.id}`), reader: "fleet" }), template);
  }
}

export async function sendTimeBoxExtensionRequest(p: {
  workOrderId: string;
  description: string;
  moreMilli: number;
  usedMs: number;
  approvedMilli: number;
  amountCents: number;
  note: string;
}): Promise<void> {
  const wo = await workOrderForMail(p.workOrderId);
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
  await sendMail(await accountRecipients(wo.accountId, ["approver"]), mail, "time_box_extension");
}
