import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accountRecipients, shopRecipients, userEmail } from "@/db/queries/recipients";
import { accounts, concerns, serviceRequestDefects, serviceRequests, shopSettings, units, users, workOrders } from "@/db/schema";
import { RESET_MINUTES } from "@/lib/auth/link-policy";
import { ROLE_LABELS, workOrderLabel, type Role } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";
import type { RenderedMail } from "./layout";
import { appUrl, sendMail } from "./send";
import { invitationMail, passwordResetMail } from "./templates/people";
import { checkedInMail, defectProgressMail, defectReportedMail } from "./templates/visits";

/**
 * Every e-mail of intake (invitations, password resets, checked-in notices,
 * defect reports) leaves through here: one place to hand messages to another
 * transport. A message whose link carries a secret is logged without it.
 */
async function deliver(to: string[], mail: RenderedMail, template: string, opts: { secretLink?: boolean } = {}) {
  const logged = opts.secretLink ? { ...mail, link: mail.link.replace(/\/[A-Za-z0-9_-]{43}$/, "/…") } : mail;
  return sendMail(to, logged, template);
}

async function shopName(): Promise<string> {
  const [row] = await getDb().select({ name: shopSettings.shopName }).from(shopSettings).limit(1);
  return row?.name ?? "the shop";
}

export async function sendInvitation(invitation: { name: string; email: string; role: Role; accountId: string | null; expiresAt: string }, token: string, invitedBy: string) {
  const [account] = invitation.accountId
    ? await getDb().select({ name: accounts.name }).from(accounts).where(eq(accounts.id, invitation.accountId)).limit(1)
    : [];
  const mail = invitationMail({
    shopName: await shopName(),
    name: invitation.name,
    invitedBy,
    roleLabel: ROLE_LABELS[invitation.role],
    accountName: account?.name ?? null,
    expiresOn: formatDateTime(invitation.expiresAt),
    url: appUrl(`/invitation/${token}`),
  });
  return deliver([invitation.email], mail, "invitation", { secretLink: true });
}

export async function sendPasswordReset(user: { name: string; email: string }, token: string) {
  const mail = passwordResetMail({ shopName: await shopName(), name: user.name, minutes: RESET_MINUTES, url: appUrl(`/reset-password/${token}`) });
  return deliver([user.email], mail, "password-reset", { secretLink: true });
}

/** "Checked in", to the account's approvers, linking to the unit's live page. */
export async function sendCheckedIn(workOrderId: string) {
  const db = getDb();
  const [wo] = await db
    .select({ number: workOrders.number, accountId: workOrders.accountId, promisedAt: workOrders.promisedAt, unitId: units.id, unitNumber: units.unitNumber, unitDescription: units.description, tech: users.name })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .leftJoin(users, eq(users.id, workOrders.assignedTechId))
    .where(eq(workOrders.id, workOrderId))
    .limit(1);
  if (!wo) return { sent: 0, failed: 0 };
  const complaints = await db.select({ complaint: concerns.complaint }).from(concerns).where(eq(concerns.workOrderId, workOrderId)).orderBy(concerns.position);
  const mail = checkedInMail({
    shopName: await shopName(),
    unitNumber: wo.unitNumber,
    unitDescription: wo.unitDescription,
    woLabel: workOrderLabel(wo.number),
    complaints: complaints.map((c) => c.complaint),
    promisedBy: wo.promisedAt ? formatDateTime(wo.promisedAt) : null,
    technician: wo.tech,
    url: appUrl(`/fleet/units/${wo.unitId}`),
  });
  return deliver(await accountRecipients(wo.accountId, ["approver"]), mail, "checked-in");
}

async function requestFacts(requestId: string) {
  const db = getDb();
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
export async function sendDefectReported(requestId: string) {
  const r = await requestFacts(requestId);
  if (!r) return { sent: 0, failed: 0 };
  const defects = await getDb()
    .select({ description: serviceRequestDefects.description, outOfService: serviceRequestDefects.outOfService })
    .from(serviceRequestDefects)
    .where(eq(serviceRequestDefects.requestId, requestId))
    .orderBy(serviceRequestDefects.position);
  const mail = defectReportedMail({ shopName: await shopName(), accountName: r.accountName, unitNumber: r.unitNumber, reporterName: r.reporterName, defects, url: appUrl("/floor#defect-reports") });
  return deliver(await shopRecipients(["owner", "writer"]), mail, "defect-reported");
}

/** To the person who reported: their report went onto a visit, or that visit is done. */
export async function sendDefectProgress(requestId: string, stage: "scheduled" | "fixed") {
  const r = await requestFacts(requestId);
  if (!r || r.workOrderNumber === null) return { sent: 0, failed: 0 };
  const mail = defectProgressMail({ shopName: await shopName(), unitNumber: r.unitNumber, woLabel: workOrderLabel(r.workOrderNumber), stage, url: appUrl("/fleet/reports") });
  return deliver(await userEmail(r.reportedBy), mail, `defect-${stage}`);
}
