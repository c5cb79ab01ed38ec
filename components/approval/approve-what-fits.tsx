"use client";

import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import type { ApprovalData, ApprovalLineData } from "./approval-data";
import { passLinesOnAction } from "@/lib/server/actions/pass-on";
// The one module, not the barrel: the browser needs the plan, not the whole estimate engine.
import { describeLeftLines, planApproveWhatFits } from "@/lib/estimate/approve-fit";
import { formatCents } from "@/lib/money";

export interface Colleague {
  id: string;
  name: string;
  signingLimitCents: number | null;
}

/**
 * Approve everything that fits the signing limit and the budget, in the order shown; say in
 * words which lines are left and why; pass the lines past the signing limit to a colleague who
 * can sign for them.
 */
export function ApproveWhatFits({
  view,
  waiting,
  colleagues,
  busy,
  onApprove,
  onPassed,
}: {
  view: Pick<ApprovalData, "id" | "limits">;
  /** Waiting lines in the order the page shows them. */
  waiting: ApprovalLineData[];
  colleagues: Colleague[];
  busy: boolean;
  onApprove: (lines: ApprovalLineData[], success: string) => void;
  onPassed: (text: string, ok: boolean) => void;
}) {
  const plan = planApproveWhatFits({
    waiting: waiting.map((l) => ({ id: l.id, description: l.description, amountCents: l.amountCents })),
    signingLimitCents: view.limits.signingLimitCents ?? 0,
    signingUsedCents: view.limits.signingUsedCents ?? 0,
    budgetCents: view.limits.budgetCents,
    budgetUsedCents: view.limits.budgetUsedCents,
  });
  const fits = waiting.filter((l) => plan.fits.some((f) => f.id === l.id));
  const overSigning = plan.left.filter((x) => x.reason === "signing_limit").map((x) => x.line);
  const [to, setTo] = useState(colleagues[0]?.id ?? "");
  const [passing, startPass] = useTransition();
  const all = fits.length === waiting.length;
  // One line that fits needs no panel: its own Approve button does it.
  if (waiting.length === 1 && all) return null;
  const pendingCents = waiting.reduce((s, l) => s + l.amountCents, 0);
  return (
    <div className="flex flex-col gap-2 rounded-card border border-rule bg-paper p-3" data-testid="approve-what-fits">
      <p className="text-sm">
        {waiting.length} lines wait for your decision, {formatCents(pendingCents)} in all.
      </p>
      {fits.length ? (
        <Button
          type="button"
          className="w-full sm:w-auto"
          disabled={busy}
          data-testid="approve-all"
          onClick={() => onApprove(fits, `Approved ${fits.length} line${fits.length === 1 ? "" : "s"} (${formatCents(plan.fitsCents)}).`)}
        >
          {all ? `Approve all ${fits.length}` : `Approve the ${fits.length} that fit (${formatCents(plan.fitsCents)})`}
        </Button>
      ) : null}
      {plan.left.length ? (
        <div className="text-sm" data-testid="lines-left">
          <p className="font-semibold">
            {plan.left.length === waiting.length ? "None of these fit" : `${plan.left.length} line${plan.left.length === 1 ? " is" : "s are"} left`}:
          </p>
          <ul className="mt-1 list-disc pl-5">
            {describeLeftLines(plan, view.limits.fiscalYear).map((text) => (
              <li key={text}>{text}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {overSigning.length ? (
        colleagues.length ? (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              startPass(async () => {
                const r = await passLinesOnAction({ workOrderId: view.id, toUserId: to, lineIds: overSigning.map((l) => l.id) });
                onPassed(r.ok ? `Passed ${r.data.count} line${r.data.count === 1 ? "" : "s"} to ${r.data.to}; they have been e-mailed a link.` : r.error, r.ok);
              });
            }}
          >
            <label className="flex flex-col gap-1 text-sm font-semibold">
              Pass {overSigning.length === 1 ? "it" : `these ${overSigning.length}`} to
              <select className="min-h-touch rounded-card border-2 border-rule-strong bg-white px-2" value={to} onChange={(e) => setTo(e.target.value)}>
                {colleagues.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.name} (signing limit {formatCents(c.signingLimitCents ?? 0)})
                  </option>
                ))}
              </select>
            </label>
            <Button type="submit" variant="secondary" disabled={busy || passing} data-testid="pass-on">
              {passing ? "Passing on…" : `Pass the rest to ${colleagues.find((c) => c.id === to)?.name ?? "them"}`}
            </Button>
          </form>
        ) : (
          <p className="text-sm text-ink-soft">Nobody else on your account has a higher signing limit: ask the shop to split the work, or your account to raise your limit.</p>
        )
      ) : null}
    </div>
  );
}
