"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { passLinesOn } from "@/db/queries/pass-on";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { queuePassedOn } from "@/lib/server/notifications/pass-on";

const id = z.string().min(1).max(64);
const input = z.object({ workOrderId: id, toUserId: id, lineIds: z.array(id).min(1, "Choose the lines to pass on.").max(200), note: z.string().trim().max(500).default("") });

/** "Pass the rest to an approver who can": a named colleague with a higher signing limit. */
export const passLinesOnAction = guardedAction({ roles: CAN.decide, input }, async ({ user, input }) => {
  const result = await passLinesOn(user, input, queuePassedOn);
  revalidatePath(`/fleet/work-orders/${result.workOrderId}`);
  return { to: result.to.name, count: result.lines.length };
});
