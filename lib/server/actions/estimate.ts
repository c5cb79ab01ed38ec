"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { addLine, bringBackDeferred, deleteLine, editLine, moveLine, setLineProgress } from "@/db/queries/estimate-lines";
import { setCoreReturned } from "@/db/queries/core-returns";
import { sendEstimate, startUnderStanding } from "@/db/queries/estimate-send";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { queueCreditNote } from "@/lib/server/notifications/invoices";
import { queueEstimateReady, queueLineReopened } from "@/lib/server/notifications/estimate";
import { queueTimeBoxNotices } from "@/lib/server/notifications/time-box";
import { scheduleTimeBoxWatch } from "@/lib/server/notifications/time-box-watch";
import { editLineInput, lineRefInput, newLineInput } from "@/lib/validation/estimate-line";
import { lineAmountCents } from "@/lib/money";

const id = z.string().min(1).max(64);

function refresh(workOrderId: string) {
  revalidatePath(`/work-orders/${workOrderId}`);
  revalidatePath(`/fleet/work-orders/${workOrderId}`);
}

export const addLineAction = guardedAction({ roles: CAN.writeEstimates, input: newLineInput }, async ({ user, input }) => {
  const row = await addLine(user, input);
  refresh(input.workOrderId);
  return { id: row.id };
});

export const editLineAction = guardedAction({ roles: CAN.writeEstimates, input: editLineInput }, async ({ user, input }) => {
  const result = await editLine(user, input, async (tx, r) => {
    await queueTimeBoxNotices(tx, r.timeBoxNotices);
    if (r.outcome !== "back_to_proposed") return;
    await queueLineReopened(tx, r.workOrderId, {
      description: r.line.description,
      approvedCents: r.previousApprovedCents ?? 0,
      revisedCents: lineAmountCents(r.line.quantityMilli, r.line.unitPriceCents),
      reason: r.reason ?? "",
    });
  });
  refresh(result.workOrderId);
  // A diagnosis line's new size moves the moment its running clocks stop.
  if (result.line.isDiagnosis) await scheduleTimeBoxWatch();
  return { outcome: result.outcome, reason: result.reason };
});

export const deleteLineAction = guardedAction({ roles: CAN.writeEstimates, input: lineRefInput.extend({ workOrderId: id }) }, async ({ user, input }) => {
  await deleteLine(user, input.lineId, input.expectedVersion);
  refresh(input.workOrderId);
  return null;
});

export const moveLineAction = guardedAction(
  { roles: CAN.writeEstimates, input: z.object({ lineId: id, workOrderId: id, direction: z.enum(["up", "down"]) }) },
  async ({ user, input }) => {
    await moveLine(user, input.lineId, input.direction);
    refresh(input.workOrderId);
    return null;
  },
);

export const sendEstimateAction = guardedAction({ roles: CAN.writeEstimates, input: z.object({ workOrderId: id }) }, async ({ user, input }) => {
  const { sentCount } = await sendEstimate(user, input.workOrderId, (tx, sent) => queueEstimateReady(tx, sent.wo, sent.sentCount));
  refresh(input.workOrderId);
  return { sentCount };
});

export const startStandingAction = guardedAction(
  { roles: CAN.writeEstimates, input: z.object({ workOrderId: id, lineIds: z.union([id, z.array(id)]).transform((v) => (Array.isArray(v) ? v : [v])) }) },
  async ({ user, input }) => {
    const count = await startUnderStanding(user, input.workOrderId, input.lineIds, (tx, applied) => queueTimeBoxNotices(tx, applied.timeBoxNotices));
    refresh(input.workOrderId);
    // A diagnosis line started under the standing authorisation sizes its time box like an approval.
    if (count > 0) await scheduleTimeBoxWatch();
    return { count };
  },
);

export const bringBackAction = guardedAction(
  { roles: CAN.writeEstimates, input: z.object({ workOrderId: id, lineIds: z.union([id, z.array(id)]).transform((v) => (Array.isArray(v) ? v : [v])) }) },
  async ({ user, input }) => {
    const count = await bringBackDeferred(user, input.workOrderId, input.lineIds);
    refresh(input.workOrderId);
    return { count };
  },
);

export const lineProgressAction = guardedAction(
  { roles: CAN.clockTime, input: z.object({ lineId: id, workOrderId: id, state: z.enum(["in_progress", "done"]) }) },
  async ({ user, input }) => {
    await setLineProgress(user, input.lineId, input.state);
    refresh(input.workOrderId);
    return null;
  },
);

export const coreReturnedAction = guardedAction(
  { roles: CAN.writeEstimates, input: z.object({ lineId: id, workOrderId: id, returned: z.boolean() }) },
  async ({ user, input }) => {
    const result = await setCoreReturned(user, input.lineId, input.returned, async (tx, r) => {
      if (r.creditNote) await queueCreditNote(tx, r.creditNote.id);
    });
    refresh(result.workOrderId);
    return { changed: result.changed, creditNote: result.creditNote?.label ?? null };
  },
);
