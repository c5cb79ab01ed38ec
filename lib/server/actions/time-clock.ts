"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { askForMoreDiagnosisTime } from "@/db/queries/time-box-extension";
import { clockIn, clockOut } from "@/db/queries/time-clock";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { queueTimeBoxExtensionRequest, queueTimeBoxNotices } from "@/lib/server/notifications/time-box";
import { scheduleTimeBoxWatch } from "@/lib/server/notifications/time-box-watch";
import { extensionInput } from "@/lib/validation/time-box";

const input = z.object({ lineId: z.string().min(1).max(64), workOrderId: z.string().min(1).max(64) });

// The notices a clock write made due are queued in that write's own transaction.
const queueNotices = (tx: Parameters<typeof queueTimeBoxNotices>[0], r: { notices: Parameters<typeof queueTimeBoxNotices>[1] }) =>
  queueTimeBoxNotices(tx, r.notices);

export const clockInAction = guardedAction({ roles: CAN.clockTime, input }, async ({ user, input }) => {
  const { entry } = await clockIn(user, input.lineId, queueNotices);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  await scheduleTimeBoxWatch();
  return { startedAt: entry.startedAt, stopAt: entry.stopAt };
});

export const clockOutAction = guardedAction({ roles: CAN.clockTime, input }, async ({ user, input }) => {
  const result = await clockOut(user, input.lineId, queueNotices);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  await scheduleTimeBoxWatch();
  return { stoppedByBoxAt: result.stoppedByBoxAt };
});

/** The writer asks the customer for more diagnosis hours in one step: a line that goes to the approver. */
export const askForMoreTimeAction = guardedAction({ roles: CAN.writeEstimates, input: extensionInput }, async ({ user, input }) => {
  const result = await askForMoreDiagnosisTime(user, input, async (tx, r) => {
    await queueTimeBoxNotices(tx, r.notices);
    await queueTimeBoxExtensionRequest(tx, r);
  });
  revalidatePath(`/work-orders/${result.workOrderId}`);
  revalidatePath(`/fleet/work-orders/${result.workOrderId}`);
  return { lineId: result.lineId };
});
