import { deliverLater } from "@/lib/mail/deliver";
import { sendCheckedIn, sendDefectProgress, sendDefectReported } from "@/lib/mail/intake-notices";

/** After a check-in commits: the account's approvers hear the unit is in; a reporter, that their report is on a visit. */
export async function afterCheckIn(wo: { id: string; serviceRequestId: string | null }) {
  await deliverLater(() => sendCheckedIn(wo.id));
  if (wo.serviceRequestId) {
    const requestId = wo.serviceRequestId;
    await deliverLater(() => sendDefectProgress(requestId, "scheduled"));
  }
}

export async function afterDefectReported(requestId: string) {
  await deliverLater(() => sendDefectReported(requestId));
}

export async function afterDefectsFixed(requestIds: string[]) {
  for (const id of requestIds) await deliverLater(() => sendDefectProgress(id, "fixed"));
}
