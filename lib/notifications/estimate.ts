import { accountRecipients, shopRecipients, userEmail } from "@/db/queries/recipients";
import { workOrderForMail } from "@/db/queries/work-order-detail";
import { workOrderLabel } from "@/lib/domain";
import { appUrl, sendMail } from "@/lib/mail/send";
import { decisionMadeMail, estimateReadyMail, lineReopenedMail } from "@/lib/mail/templates/estimate";

export type WoRef = Awaited<ReturnType<typeof workOrderForMail>>;

const fleetLink = (woId: string) => appUrl(`/fleet/work-orders/${woId}`);
const shopLink = (woId: string) => appUrl(`/work-orders/${woId}`);

/** The writer who opened the work order, or every writer when it was someone else. */
export async function writersFor(wo: WoRef): Promise<string[]> {
  const own = await userEmail(wo.createdBy);
  const writers = await shopRecipients(["writer"]);
  return own.length && writers.includes(own[0]!) ? own : writers;
}

export async function notifyEstimateReady(workOrderId: string, lineCount: number, pendingCents: number, outOfService: boolean) {
  const wo = await workOrderForMail(workOrderId);
  const to = await accountRecipients(wo.accountId, ["approver"]);
  const mail = estimateReadyMail({ woLabel: workOrderLabel(wo.number), unitNumber: wo.unitNumber, title: wo.title, lineCount, pendingCents, outOfService, url: fleetLink(wo.id) });
  return sendMail(to, mail, "estimate_ready");
}

export async function notifyDecisionMade(workOrderId: string, approverName: string, summary: string, stillPending: number) {
  const wo = await workOrderForMail(workOrderId);
  const mail = decisionMadeMail({ woLabel: workOrderLabel(wo.number), unitNumber: wo.unitNumber, approverName, summary, stillPending, url: shopLink(wo.id) });
  return sendMail(await writersFor(wo), mail, "decision_made");
}

export async function notifyLineReopened(workOrderId: string, line: { description: string; approvedCents: number; revisedCents: number; reason: string }) {
  const wo = await workOrderForMail(workOrderId);
  const to = await accountRecipients(wo.accountId, ["approver"]);
  const mail = lineReopenedMail({ woLabel: workOrderLabel(wo.number), unitNumber: wo.unitNumber, ...line, url: fleetLink(wo.id) });
  return sendMail(to, mail, "line_reopened");
}

