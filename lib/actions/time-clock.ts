"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { askForMoreDiagnosisTime } from "@/db/queries/time-box-extension";
import { clockIn, clockOut } from "@/db/queries/time-clock";
import { guardedAction } from "@/lib/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { deliverLater } from "@/lib/mail/deliver";
import { sendTimeBoxExtensionRequest } from "@/lib/notifications/time-box";
import { deliverTimeBoxNotices, scheduleTimeBoxWatch } from "@/lib/notifications/time-box-watch";
import { extensionInput } from "@/lib/validation/time-box";

const input = z.object({ lineId: z.string().min(1).max(64), workOrderId: z.string().min(1).max(64) });

export const clockInAction = guardedAction({ roles: CAN.clockTime, input }, async ({ user, input }) => {
  const { entry, notices } = await clockIn(user, input.lineId);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  await deliverTimeBoxNotices(notices);
  await scheduleTimeBoxWatch();
  return { startedAt: entry.startedAt, stopAt: entry.stopAt };
});

export const clockOutAction = guardedAction({ roles: CAN.clockTime, input }, async ({ user, input }) => {
  const result = await clockOut(user, input.lineId);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  await deliverTimeBoxNotices(result.notices);
  await scheduleTimeBoxWatch();
  return { stoppedByBoxAt: result.stoppedByBoxAt };
});

/** The writer asks the customer for more diagnosis hours in one step: a line that goes to the approver. */
export const askForMoreTimeAction = guardedAction({ roles: CAN.writeEstimates, input: extensionInput }, async ({ user, input }) => {
  const result = await askForMoreDiagnosisTime(user, input);
  revalidatePath(`/work-orders/${result.workOrderId}`);
  revalidatePath(`/fleet/work-orders/${result.workOrderId}`);
  await deliverLater(() => sendTimeBoxExtensionRequest(result));
  return { lineId: result.lineId };
});
