"use client";

import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { Money } from "@/components/ui/money";
import type { LineView } from "@/db/queries/work-order-view";
import { LINE_KIND_LABELS } from "@/lib/domain";
import { coreReturnedAction, deleteLineAction, moveLineAction, startStandingAction } from "@/lib/server/actions/estimate";
import { isApprovedState } from "@/lib/estimate";
import { formatDate, formatQuantity } from "@/lib/format";
import { DecisionLine, LineStatePill } from "./line-state";

const small = "min-h-9 rounded-card border border-rule-strong px-2 text-sm font-semibold hover:bg-paper-deep disabled:opacity-40";

/** One line of the shop's estimate with its state, decision and what the writer may do to it. */
export function LineRow({
  line,
  workOrderId,
  canStartStanding,
  onEdit,
  onError,
  first,
  last,
}: {
  line: LineView;
  workOrderId: string;
  canStartStanding: boolean;
  onEdit: () => void;
  onError: (message: string) => void;
  first: boolean;
  last: boolean;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const run = (fn: () => Promise<{ ok: boolean; error?: string }>) =>
    start(async () => {
      const result = await fn();
      if (!result.ok) onError(result.error ?? "That did not work.");
      router.refresh();
    });
  const editable = line.state !== "declined" && line.state !== "held";
  const removable = line.state === "draft" || line.state === "proposed";

  return (
    <tr className="border-t border-rule align-top" data-testid="estimate-line" data-line-id={line.id}>
      <td className="py-2 pr-2 text-xs font-semibold text-ink-faint uppercase">{LINE_KIND_LABELS[line.kind]}</td>
      <td className="py-2 pr-2">
        <p className="font-semibold">
          {line.description}
          {line.isDiagnosis ? <span className="ml-1 text-xs font-normal text-ink-faint">(diagnosis)</span> : null}
        </p>
        {line.partNumber ? <p className="text-xs text-ink-faint">Part {line.partNumber}</p> : null}
        {line.coreChargeCents ? (
          <p className="text-xs text-ink-faint" data-testid="core-charge">
            {line.coreReturnedAt ? (
              <>
                Core came back {formatDate(line.coreReturnedAt)}: <Money cents={line.coreTotalCents} /> credited
              </>
            ) : (
              <>
                Core charge <Money cents={line.coreTotalCents} /> (not taxed; credited when the core comes back)
              </>
            )}
          </p>
        ) : null}
        {line.reopenReason && line.state === "proposed" ? (
          <p className="text-xs font-semibold text-rust-deep">
            {line.extendsLineId ? "More time asked for" : "Back for approval"}: {line.reopenReason}
          </p>
        ) : null}
        {line.deferredFromLineId ? <p className="text-xs text-ink-faint">Brought back from an earlier visit</p> : null}
        <DecisionLine decision={line.decision} />
      </td>
      <td className="figures py-2 pr-2 text-right">{formatQuantity(line.quantity * 1000)}</td>
      <td className="py-2 pr-2 text-right">
        <Money cents={line.unitPriceCents} />
      </td>
      <td className="py-2 pr-2 text-right font-semibold">
        <Money cents={line.amountCents} />
        {line.taxable ? <span className="block text-xs font-normal text-ink-faint">taxable</span> : null}
      </td>
      <td className="py-2 pr-2">
        <LineStatePill state={line.state} />
      </td>
      <td className="w-56 py-2">
        {/* The everyday actions stay on one row; the longer ones go on their own row below. */}
        <div className="flex flex-nowrap justify-end gap-1 whitespace-nowrap" data-testid="line-actions">
          <button type="button" className={small} disabled={pending || first} onClick={() => run(() => moveLineAction({ lineId: line.id, workOrderId, direction: "up" }))} aria-label={`Move ${line.description} up`}>
            ↑
          </button>
          <button type="button" className={small} disabled={pending || last} onClick={() => run(() => moveLineAction({ lineId: line.id, workOrderId, direction: "down" }))} aria-label={`Move ${line.description} down`}>
            ↓
          </button>
          {editable ? (
            <button type="button" className={small} onClick={onEdit}>
              Edit
            </button>
          ) : null}
          {removable ? (
            <button type="button" className={small} disabled={pending} onClick={() => run(() => deleteLineAction({ lineId: line.id, expectedVersion: line.version, workOrderId }))}>
              Remove
            </button>
          ) : null}
        </div>
        <div className="mt-1 flex flex-wrap justify-end gap-1 empty:hidden">
          {canStartStanding && (line.state === "draft" || line.state === "proposed") ? (
            <button type="button" className={`${small} border-ink`} disabled={pending} onClick={() => run(() => startStandingAction({ workOrderId, lineIds: [line.id] }))}>
              Start now (standing authorisation)
            </button>
          ) : null}
          {line.kind === "part" && line.coreChargeCents && isApprovedState(line.state) ? (
            <button
              type="button"
              className={small}
              disabled={pending}
              onClick={() => run(() => coreReturnedAction({ lineId: line.id, workOrderId, returned: !line.coreReturnedAt }))}
            >
              {line.coreReturnedAt ? "Undo core return" : "Core came back"}
            </button>
          ) : null}
        </div>
      </td>
    </tr>
  );
}
