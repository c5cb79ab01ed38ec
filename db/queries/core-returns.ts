import { and, eq, gt } from "drizzle-orm";
import { writeTxThen, type InSameTx } from "@/db/client";
import { estimateLines, invoiceLines, statusEvents } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invoiceLabel, workOrderLabel } from "@/lib/domain";
import { isApprovedState } from "@/lib/estimate";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { formatCents, lineAmountCents } from "@/lib/money";
import { recordAudit } from "./audit";
import { creditInvoiceInTx } from "./credit-notes";
import { liveInvoiceOf } from "./invoice-issue";
import { loadLineContext } from "./estimate-lines";

/**
 * Records that a part's old core came back to the shop (or takes that back).
 * A returned core leaves the estimate's totals and is not charged when the
 * work order is invoiced. An issued invoice never changes: when it charged the
 * core, a credit note for the core goes against it (up to what is still owed).
 * The timeline tells the fleet.
 */
export async function setCoreReturned(user: SessionUser, lineId: string, returned: boolean, notify?: InSameTx<{ creditNote: { id: string } | null }>) {
  return writeTxThen(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, lineId);
    if (line.kind !== "part" || line.coreChargeCents === 0) {
      throw conflict("no_core_charge", `“${line.description}” has no core charge.`);
    }
    if (!isApprovedState(line.state)) {
      throw conflict("not_approved", `“${line.description}” is not approved, so there is no core to credit yet.`);
    }
    if ((line.coreReturnedAt !== null) === returned) return { workOrderId: ctx.wo.id, changed: false, creditNote: null };

    const live = await liveInvoiceOf(tx, ctx.wo.id);
    const coreCents = lineAmountCents(line.quantityMilli, line.coreChargeCents);
    let creditNote: { id: string; label: string } | null = null;
    if (live) {
      const [charged] = await tx
        .select({ id: invoiceLines.id })
        .from(invoiceLines)
        .where(and(eq(invoiceLines.invoiceId, live.id), eq(invoiceLines.sourceLineId, line.id), gt(invoiceLines.coreChargeCents, 0)))
        .limit(1);
      // Only a core the issued invoice charged can be credited; anything else would mean changing the invoice.
      if (!returned) {
        throw conflict(
          "already_invoiced",
          `${workOrderLabel(ctx.wo.number)} is on ${invoiceLabel(live.number)}, and the core was not charged there or was credited against it; an issued invoice and its credit notes do not change.`,
        );
      }
      if (!charged) {
        throw conflict(
          "already_invoiced",
          `${workOrderLabel(ctx.wo.number)} is on ${invoiceLabel(live.number)}, and an issued invoice does not change. ` +
            `Void ${invoiceLabel(live.number)} first (possible while nothing is paid on it), then record the core and issue the invoice again.`,
        );
      }
      creditNote = await creditInvoiceInTx(tx, user, live, {
        amountCents: coreCents,
        reason: `Core returned: ${line.description}`,
        coreLineId: line.id,
      });
    }

    const at = nowIso();
    await tx.update(estimateLines).set({ coreReturnedAt: returned ? at : null, updatedAt: at }).where(eq(estimateLines.id, line.id));
    await tx.insert(statusEvents).values({
      workOrderId: ctx.wo.id,
      status: ctx.wo.status,
      note: returned
        ? `Core came back for “${line.description}”: ${formatCents(coreCents)} credited${creditNote ? ` (${creditNote.label})` : ""}.`
        : `Core return taken back for “${line.description}”: the ${formatCents(coreCents)} core charge applies again.`,
      byUserId: user.id,
      at,
    });
    await recordAudit(tx, user, {
      action: returned ? "estimate.core_returned" : "estimate.core_return_undone",
      entityType: "work_order",
      entityId: ctx.wo.id,
      accountId: ctx.account.id,
      detail: { lineId: line.id, coreCents },
    });
    return { workOrderId: ctx.wo.id, changed: true, creditNote };
  }, notify);
}
