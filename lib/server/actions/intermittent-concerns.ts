"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { closeConcern, markIntermittent } from "@/db/queries/intermittent-concerns";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { closeConcernInput, markIntermittentInput } from "@/lib/validation/intermittent-concern";

function refresh(concernId: string, unitId: string) {
  revalidatePath(`/concerns/${concernId}`);
  revalidatePath(`/units/${unitId}`);
  revalidatePath(`/fleet/units/${unitId}`);
  revalidatePath("/work-orders/[id]", "page");
}

/** Writer or technician: this concern comes and goes; here is what to record each time. */
export const markIntermittentAction = guardedAction({ roles: CAN.postFindings, input: markIntermittentInput }, async ({ user, input }) => {
  const done = await markIntermittent(user, input.concernId, input.recordHint);
  refresh(done.id, done.unitId);
  return done;
});

/** Writer or technician: the cause is found; the fleet sees the conclusion. */
export const closeConcernAction = guardedAction({ roles: CAN.postFindings, input: closeConcernInput }, async ({ user, input }) => {
  const done = await closeConcern(user, input.concernId, input.conclusion);
  refresh(done.id, done.unitId);
  return done;
});
