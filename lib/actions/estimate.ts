"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { addLine, bringBackDeferred, deleteLine, editLine, moveLine, setLineProgress } from "@/db/queries/estimate-lines";
import { setCoreReturned } from "@/db/queries/core-returns";
import { sendEstimate, startUnderStanding } from "@/db/queries/estimate-send";
import { workOrderView } from "@/db/queries/work-order-view";
import { guardedAction } from "@/lib/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { deliverLater } from "@/lib/mail/deliver";
import { notifyCreditNote } from "@/lib/mail/invoice-notices";
import { notifyEstimateReady, notifyLineReopened } from "@/lib/notifications/estimate";
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
  const result = await editLine(user, input);
  refresh(result.workOrderId);
  if (result.outcome === "back_to_proposed") {
    await deliverLater(() =>
      notifyLineReopened(result.workOrderId, {
        description: result.line.description,
        approvedCents: result.previousApprovedCents ?? 0,
        revisedCents: lineAmountCents(result.line.quantityMilli, result.line.unitPriceCents),
        reason: result.reason ?? "",
      }),
    );
  }
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
  const { sentCount } = await sendEstimate(user, input.workOrderId);
  refresh(input.workOrderId);
  const view = await workOrderView(user, input.workOrderId);
  await deliverLater(() =>
    notifyEstimateReady(input.workOrderId, sentCount, view?.totals.pendingCents ?? 0, view?.findings.some((f) => f.severity === "out_of_service") ?? false),
  );
  return { sentCount };
});

export const startStandingAction = guardedAction(
  { roles: CAN.writeEstimates, input: z.object({ workOrderId: id, lineIds: z.union([id, z.array(id)]).transform((v) => (Array.isArray(v) ? v : [v])) }) },
  async ({ user, input }) => {
    const count = await startUnderStanding(user, input.workOrderId, input.lineIds);
    refresh(input.workOrderId);
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
    const result = await setCoreReturned(user, input.lineId, input.returned);
    if (result.creditNote) void deliverLater(() => notifyCreditNote(result.creditNote!.id));
    refresh(result.workOrderId);
    return { changed: result.changed, creditNote: result.creditNote?.label ?? null };
  },
);
