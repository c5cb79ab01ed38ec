import { eq } from "drizzle-orm";
import { writeTxThen, type InSameTx } from "@/db/client";
import { estimateLines, statusEvents, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { formatClock, formatTenths, isApprovedState } from "@/lib/estimate";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { lineAmountCents } from "@/lib/money";
import type { ExtensionInput } from "@/lib/validation/time-box";
import { recordAudit } from "./audit";
import { assertOpen, loadLineContext } from "./estimate-lines";
import { clockOfGroup, loadBoxGroup, settleTimeBoxes, type TimeBoxNoticeDue } from "./time-box-stops";

/**
 * The writer asks the customer for more diagnosis hours in one step. The approved diagnosis line
 * keeps its approval (and every minute already clocked on it); the extra hours go to the approver
 * as a line of their own that widens that line's box once approved, under the same signing
 * limits and budget as any other line.
 */
export interface ExtensionAsked {
  lineId: string;
  workOrderId: string;
  description: string;
  moreMilli: number;
  usedMs: number;
  approvedMilli: number;
  amountCents: number;
  note: string;
  /** Notices that settling the running clocks made due, for the caller to queue in this transaction. */
  notices: TimeBoxNoticeDue[];
}

export async function askForMoreDiagnosisTime(user: SessionUser, input: ExtensionInput, notify?: InSameTx<ExtensionAsked>): Promise<ExtensionAsked> {
  return writeTxThen(async (tx) => {
    const at = nowIso();
    const notices = await settleTimeBoxes(tx, at);
    const { ctx, line } = await loadLineContext(tx, user, input.lineId);
    assertOpen(ctx);
    if (!line.isDiagnosis || line.extendsLineId || line.kind !== "labor") {
      throw conflict("not_diagnosis", "More time can be asked for on a diagnosis line only.");
    }
    if (!isApprovedState(line.state)) throw conflict("not_approved", "This diagnosis line is not approved yet: change its hours instead.");
    const clock = clockOfGroup(await loadBoxGroup(tx, line.id), Date.parse(at));
    const description = `More diagnosis time, ${formatTenths(input.hours)}: ${line.description}`;
    const position = Math.max(...ctx.lines.map((l) => l.position)) + 1;
    const [row] = await tx
      .insert(estimateLines)
      .values({
        workOrderId: ctx.wo.id,
        concernId: line.concernId,
        findingId: line.findingId,
        position,
        kind: "labor",
        description,
        quantityMilli: input.hours,
        unitPriceCents: line.unitPriceCents,
        taxable: line.taxable,
        laborRateId: line.laborRateId,
        isDiagnosis: true,
        extendsLineId: line.id,
        state: "proposed",
        reopenReason: `${formatClock(clock.usedMs)} of the ${formatTenths(clock.approvedMilli)} approved are used${input.note ? `; ${input.note}` : ""}`,
        createdBy: user.id,
      })
      .returning();
    await tx.insert(statusEvents).values({
      workOrderId: ctx.wo.id,
      status: ctx.wo.status,
      note: `The shop asks for ${formatTenths(input.hours)} more diagnosis time on “${line.description}” (${formatClock(clock.usedMs)} of ${formatTenths(clock.approvedMilli)} used).`,
      byUserId: user.id,
      at,
    });
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, ctx.wo.id));
    await recordAudit(tx, user, {
      action: "line.time_box_extension",
      entityType: "line",
      entityId: row!.id,
      accountId: ctx.wo.accountId,
      detail: { extendsLineId: line.id, hoursMilli: input.hours, note: input.note },
    });
    return {
      lineId: row!.id,
      workOrderId: ctx.wo.id,
      description: line.description,
      moreMilli: input.hours,
      usedMs: clock.usedMs,
      approvedMilli: clock.approvedMilli,
      amountCents: lineAmountCents(input.hours, line.unitPriceCents),
      note: input.note,
      notices,
    };
  }, notify);
}
