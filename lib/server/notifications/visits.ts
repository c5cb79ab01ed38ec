import "server-only";
import type { Tx } from "@/db/client";
import { queueCheckedIn, queueDefectProgress, queueDefectReported } from "@/lib/server/notifications/intake";

/*
 * Passed to the visit writes as their `notify`: each runs inside the write's
 * own transaction, so the e-mail is queued exactly when the change commits.
 */

/** A check-in: the account's approvers hear the unit is in; a reporter, that their report is on a visit. */
export async function checkedInNotice(tx: Tx, wo: { id: string; serviceRequestId: string | null }): Promise<void> {
  await queueCheckedIn(tx, wo.id);
  if (wo.serviceRequestId) await queueDefectProgress(tx, wo.serviceRequestId, "scheduled");
}

export async function defectReportedNotice(tx: Tx, request: { id: string }): Promise<void> {
  await queueDefectReported(tx, request.id);
}

export async function defectsFixedNotice(tx: Tx, requestIds: readonly string[]): Promise<void> {
  for (const id of requestIds) await queueDefectProgress(tx, id, "fixed");
}
