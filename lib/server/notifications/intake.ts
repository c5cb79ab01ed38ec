import "server-only";
import { eq } from "drizzle-orm";
import type { Reader, Tx } from "@/db/client";
import { accountRecipients, shopRecipients, userEmail } from "@/db/queries/recipients";
import { accounts, concerns, serviceRequestDefects, serviceRequests, shopSettings, units, users, workOrders } from "@/db/schema";
import { RESET_MINUTES } from "@/lib/auth/link-policy";
import { ROLE_LABELS, workOrderLabel, type Role } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { invitationMail, passwordResetMail } from "@/lib/mail/templates/people";
import { checkedInMail, defectProgressMail, defectReportedMail } from "@/lib/mail/templates/visits";

/*
 * Every e-mail of intake (invitations, password resets, checked-in notices,
 * defect reports) is queued here, inside the transaction of the change it
 * reports. A message whose link carries a secret is marked so: the outbox
 * shows its link without the token and drops the body once it has gone.
 */

async function shopName(db: Reader): Promise<string> {
  const [row] = await db.select({ name: shopSettings.shopName }).from(shopSettings).limit(1);
  return row?.name ?? "the shop";
}

export async function queueInvitation(
  tx: Tx,
  invitation: { name: string; email: string; role: Role; accountId: string | null; expiresAt: string },
  token: string,
  invitedBy: string,
) {
  const [account] = invitation.accountId ? await tx.select({ name: accounts.name }).from(accounts).where(eq(accounts.id, invitation.accountId)).limit(1) : [];
  const mail = invitationMail({
    shopName: await shopName(tx),
    name: invitation.name,
    invitedBy,
    roleLabel: ROLE_LABELS[invitation.role],
    accountName: account?.name ?? null,
    expiresOn: formatDateTime(invitation.expiresAt),
    url: appUrl(`/invitation/${token}`),
  });
  await queueMail(tx, { to: [invitation.email], template: "invitation", mail, secret: true });
}

export async function queuePasswordReset(tx: Tx, user: { name: string; email: string }, token: string) {
  const mail = passwordResetMail({ shopName: await shopName(tx), name: user.name, minutes: RESET_MINUTES, url: appUrl(`/reset-password/${token}`) });
  await queueMail(tx, { to: [user.email], template: "password-reset", mail, secret: true });
}

/** "Checked in", to the account's approvers, linking to the unit's live page. */
export async function queueCheckedIn(tx: Tx, workOrderId: string) {
  const [wo] = await tx
    .select({ number: workOrders.number, accountId: workOrders.accountId, promisedAt: workOrders.promisedAt, unitId: units.id, unitNumber: units.unitNumber, unitDescription: units.description, tech: users.name })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .leftJoin(users, eq(users.id, workOrders.assignedTechId))
    .where(eq(workOrders.id, workOrderId))
    .limit(1);
  if (!wo) return;
  const complaints = await tx.select({ complaint: concerns.complaint }).from(concerns).where(eq(concerns.workOrderId, workOrderId)).orderBy(concerns.position);
  const mail = checkedInMail({
    shopName: await shopName(tx),
    unitNumber: wo.unitNumber,
    unitDescription: wo.unitDescription,
    woLabel: workOrderLabel(wo.number),
    complaints: complaints.map((c) => c.complaint),
    promisedBy: wo.promisedAt ? formatDateTime(wo.promisedAt) : null,
    technician: wo.tech,
    url: appUrl(`/fleet/units/${wo.unitId}`),
  });
  await queueMail(tx, { to: await accountRecipients(wo.accountId, ["approver"], tx), template: "checked-in", mail });
}

async function requestFacts(db: Reader, requestId: string) {
  const [r] = await db
    .select({ id: serviceRequests.id, reporterName: serviceRequests.reporterName, reportedBy: serviceRequests.reportedBy, accountName: accounts.name, unitNumber: units.unitNumber, workOrderNumber: workOrders.number })
    .from(serviceRequests)
    .innerJoin(accounts, eq(accounts.id, serviceRequests.accountId))
    .innerJoin(units, eq(units.id, serviceRequests.unitId))
    .leftJoin(workOrders, eq(workOrders.id, serviceRequests.workOrderId))
    .where(eq(serviceRequests.id, requestId))
    .limit(1);
  return r ?? null;
}

/** A new defect report, to the owner and service writers. */
export async function queueDefectReported(tx: Tx, requestId: string) {
  const r = await requestFacts(tx, requestId);
  if (!r) return;
  const defects = await tx
    .select({ description: serviceRequestDefects.description, outOfService: serviceRequestDefects.outOfService })
    .from(serviceRequestDefects)
    .where(eq(serviceRequestDefects.requestId, requestId))
    .orderBy(serviceRequestDefects.position);
  const mail = defectReportedMail({ shopName: await shopName(tx), accountName: r.accountName, unitNumber: r.unitNumber, reporterName: r.reporterName, defects, url: appUrl("/floor#defect-reports") });
  await queueMail(tx, { to: await shopRecipients(["owner", "writer"], tx), template: "defect-reported", mail });
}

/** To the person who reported: their report went onto a visit, or that visit is done. */
export async function queueDefectProgress(tx: Tx, requestId: string, stage: "scheduled" | "fixed") {
  const r = await requestFacts(tx, requestId);
  if (!r || r.workOrderNumber === null) return;
  const mail = defectProgressMail({ shopName: await shopName(tx), unitNumber: r.unitNumber, woLabel: workOrderLabel(r.workOrderNumber), stage, url: appUrl("/fleet/reports") });
  await queueMail(tx, { to: await userEmail(r.reportedBy, tx), template: `defect-${stage}`, mail });
}
