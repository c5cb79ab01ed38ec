"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { checkIn } from "@/db/queries/check-in";
import { addConcern, updateConcern, updateVisit } from "@/db/queries/visit-writes";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { invalidInput } from "@/lib/http/problem";
import { fieldProblems } from "@/lib/http/zod-problems";
import { checkedInNotice } from "@/lib/server/notifications/visits";
import { checkInInput, concernAddInput, concernFormInput, visitFormInput, visitPatchInput } from "@/lib/validation/visit";
import { z } from "zod";

function refresh(workOrderId: string) {
  revalidatePath(`/work-orders/${workOrderId}`);
  revalidatePath(`/fleet/work-orders/${workOrderId}`);
  revalidatePath("/floor");
}

export const checkInAction = guardedAction({ roles: CAN.manageAccounts, input: checkInInput }, async ({ user, input }) => {
  const wo = await checkIn(user, input, checkedInNotice);
  revalidatePath("/floor");
  // Straight to the new visit: the check-in page itself now says the unit is in the shop.
  redirect(`/work-orders/${wo.id}`);
});

/** The writer's visit details: technician, promised-by, PO number (empty clears). */
export const visitDetailsAction = guardedAction({ roles: CAN.manageAccounts, input: visitFormInput }, async ({ user, input }) => {
  const patch = visitPatchInput.safeParse({ assignedTechId: input.assignedTechId, promisedAt: input.promisedAt, poNumber: input.poNumber });
  if (!patch.success) throw invalidInput(fieldProblems(patch.error));
  const result = await updateVisit(user, input.workOrderId, patch.data);
  refresh(input.workOrderId);
  return result;
});

export const addConcernAction = guardedAction({ roles: CAN.moveStatus, input: concernAddInput.extend({ workOrderId: z.string().min(1).max(64) }) }, async ({ user, input }) => {
  const row = await addConcern(user, input.workOrderId, input.complaint);
  refresh(input.workOrderId);
  return { id: row.id };
});

export const concernAction = guardedAction({ roles: CAN.moveStatus, input: concernFormInput }, async ({ user, input }) => {
  const result = await updateConcern(user, input.concernId, { cause: input.cause, correction: input.correction });
  if (result.workOrderId) refresh(result.workOrderId);
  return { changed: result.changed };
});
