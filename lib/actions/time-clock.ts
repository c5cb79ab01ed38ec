"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { clockIn, clockOut } from "@/db/queries/time-clock";
import { guardedAction } from "@/lib/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { formatHours } from "@/lib/estimate";
import { queueTimeBoxReached } from "@/lib/notifications/estimate";

const input = z.object({ lineId: z.string().min(1).max(64), workOrderId: z.string().min(1).max(64) });

export const clockInAction = guardedAction({ roles: CAN.clockTime, input }, async ({ user, input }) => {
  const entry = await clockIn(user, input.lineId);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  return { startedAt: entry.startedAt };
});

export const clockOutAction = guardedAction({ roles: CAN.clockTime, input }, async ({ user, input }) => {
  const result = await clockOut(user, input.lineId, async (tx, r) => {
    if (r.reachedNow && r.box) await queueTimeBoxReached(tx, r.workOrderId, r.lineDescription, formatHours(r.box.approvedMilli));
  });
  revalidatePath(`/work-orders/${input.workOrderId}`);
  return { box: result.box, capped: result.capped };
});
