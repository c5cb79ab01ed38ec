"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import type { LineView, WorkOrderView } from "@/db/queries/work-order-view";
import type { LineKind } from "@/lib/domain";
import { sendEstimateAction } from "@/lib/server/actions/estimate";
import { isApprovedState, priceEstimate, type AccountSettings, type EstimateLine, type ShopSettings } from "@/lib/estimate";
import { formatCents } from "@/lib/money";
import { LineForm, valuesToLine, type LineFormValues, type RateOption } from "./line-form";
import { LineRow } from "./line-row";
import { sendLabel } from "./line-values";
import { TotalsBar } from "./totals-bar";

type Editing = { lineId: string | "new"; concernId: string; values: LineFormValues } | null;

function toEstimateLine(l: LineView): EstimateLine {
  return {
    id: l.id,
    kind: l.kind,
    quantityMilli: Math.round(l.quantity * 1000),
    unitPriceCents: l.unitPriceCents,
    taxable: l.taxable,
    // As the server prices it (db/queries/estimate-context): a core that came back is credited.
    coreChargeCents: l.coreReturnedAt ? 0 : l.coreChargeCents,
    state: l.state,
    version: l.version,
    approvedByUserId: null,
    byStanding: l.byStanding,
    approvedAmountCents: null,
    isDiagnosis: l.isDiagnosis,
  };
}

function formValues(l: LineView): LineFormValues {
  return {
    kind: l.kind,
    description: l.description,
    partNumber: l.partNumber,
    quantity: String(l.quantity),
    unitPrice: (l.unitPriceCents / 100).toFixed(2),
    taxable: l.taxable,
    coreCharge: (l.coreChargeCents / 100).toFixed(2),
    concernId: l.concernId ?? "",
    isDiagnosis: l.isDiagnosis,
  };
}

/**
 * The writer's estimate: lines grouped under their concerns, priced as they
 * are typed, then sent to the fleet. Totals follow the same pure rules the
 * server applies.
 */
export function EstimateEditor({
  view,
  rates,
  taxDefaults,
  shop,
  account,
  taxExempt,
}: {
  view: WorkOrderView;
  rates: RateOption[];
  taxDefaults: Record<LineKind, boolean>;
  shop: ShopSettings;
  account: AccountSettings;
  taxExempt: boolean;
}) {
  const router = useRouter();
  const [editing, setEditing] = useState<Editing>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [sending, startSend] = useTransition();
  const closed = view.status === "released";

  const groups = [
    ...view.concerns.map((c, i) => ({ id: c.id, title: `${i + 1}. ${c.complaint}`, cause: c.cause })),
    { id: "", title: "Not tied to a concern", cause: "" },
  ];
  const concernOptions = view.concerns.map((c, i) => ({ id: c.id, label: `${i + 1}. ${c.complaint.slice(0, 60)}` }));

  // Live totals: the saved lines with the line being typed put in (or added).
  const preview = useMemo(() => {
    const lines = view.lines.map(toEstimateLine);
    if (!editing) return null;
    const p = valuesToLine(editing.values);
    if (!p.ok) return null;
    const edited: EstimateLine = {
      ...(lines.find((l) => l.id === editing.lineId) ?? { id: "new", state: "draft", version: 1, approvedByUserId: null, byStanding: false, approvedAmountCents: null }),
      kind: editing.values.kind,
      quantityMilli: p.quantityMilli,
      unitPriceCents: p.unitPriceCents,
      taxable: editing.values.taxable,
      coreChargeCents: 0,
      isDiagnosis: editing.values.isDiagnosis,
    } as EstimateLine;
    const next = editing.lineId === "new" ? [...lines, edited] : lines.map((l) => (l.id === edited.id ? edited : l));
    return priceEstimate(next, shop, account);
  }, [editing, view.lines, shop, account]);

  const standingUsed = view.lines.filter((l) => l.byStanding && isApprovedState(l.state)).reduce((s, l) => s + l.amountCents, 0);
  const standingLeft = view.limits.standingAuthorisationCents - standingUsed;
  const drafts = view.lines.filter((l) => l.state === "draft");
  const totals = preview?.totals ?? view.totals;
  const draftCents = preview ? preview.byState.draft.amountCents : view.estimateTotals.draftCents;

  const blank = (concernId: string): LineFormValues => ({
    kind: "labor",
    description: "",
    partNumber: "",
    quantity: "1.0",
    unitPrice: (((rates.find((r) => r.isDefault) ?? rates[0])?.rateCents ?? 0) / 100).toFixed(2),
    taxable: taxDefaults.labor,
    coreCharge: "",
    concernId,
    isDiagnosis: false,
  });

  function send() {
    startSend(async () => {
      const result = await sendEstimateAction({ workOrderId: view.id });
      if (!result.ok) setError(result.error);
      else setNotice(`Sent ${result.data.sentCount} line${result.data.sentCount === 1 ? "" : "s"} to ${view.accountName}; their approvers have been e-mailed.`);
      router.refresh();
    });
  }

  return (
    <div className="flex flex-col gap-4" data-testid="estimate-editor">
      {notice ? (
        <p role="status" className="rounded-card border-2 border-ink bg-paper px-3 py-2 text-sm font-semibold">
          {notice}
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
          {error}
        </p>
      ) : null}
      {groups.map((g) => {
        const lines = view.lines.filter((l) => (l.concernId ?? "") === g.id);
        if (!g.id && !lines.length && editing?.concernId !== "") return null;
        return (
          <section key={g.id || "none"} aria-label={g.title}>
            <h3 className="font-bold">{g.title}</h3>
            {g.cause ? <p className="text-sm text-ink-soft">Cause: {g.cause}</p> : null}
            <div className="overflow-x-auto">
              <table className="mt-1 w-full min-w-[46rem] text-sm">
                <thead className="sr-only">
                  <tr>
                    <th>Kind</th>
                    <th>Description</th>
                    <th>Quantity</th>
                    <th>Unit price</th>
                    <th>Amount</th>
                    <th>State</th>
                    <th>Actions</th>
                  </tr>
                </thead>
                <tbody>
                  {lines.map((line, i) =>
                    editing?.lineId === line.id ? (
                      <tr key={line.id}>
                        <td colSpan={7} className="py-2">
                          <LineForm
                            workOrderId={view.id}
                            concerns={concernOptions}
                            rates={rates}
                            taxDefaults={taxDefaults}
                            initial={editing.values}
                            line={{ id: line.id, version: line.version }}
                            onChange={(values) => setEditing({ ...editing, values })}
                            onDone={(n) => {
                              setEditing(null);
                              setNotice(n ?? null);
                            }}
                          />
                        </td>
                      </tr>
                    ) : (
                      <LineRow
                        key={line.id}
                        line={line}
                        workOrderId={view.id}
                        first={i === 0}
                        last={i === lines.length - 1}
                        canStartStanding={!closed && line.amountCents <= standingLeft}
                        onEdit={() => setEditing({ lineId: line.id, concernId: g.id, values: formValues(line) })}
                        onError={setError}
                      />
                    ),
                  )}
                </tbody>
              </table>
            </div>
            {closed ? null : editing?.lineId === "new" && editing.concernId === g.id ? (
              <LineForm
                workOrderId={view.id}
                concerns={concernOptions}
                rates={rates}
                taxDefaults={taxDefaults}
                initial={editing.values}
                onChange={(values) => setEditing({ ...editing, values })}
                onDone={() => setEditing(null)}
              />
            ) : (
              <button
                type="button"
                className="mt-1 min-h-touch text-sm font-semibold text-rust-deep underline underline-offset-4"
                onClick={() => setEditing({ lineId: "new", concernId: g.id, values: blank(g.id) })}
              >
                + Add a line{g.id ? " to this concern" : ""}
              </button>
            )}
          </section>
        );
      })}
      <TotalsBar totals={totals} draftCents={draftCents} ifAllPendingApprovedCents={preview?.ifAllPendingApproved.totalCents ?? view.estimateTotals.ifAllPendingApprovedCents} taxExempt={taxExempt} />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="button" onClick={send} disabled={sending || closed || drafts.length === 0} data-testid="send-estimate">
          {sendLabel(drafts.length, view.accountName, sending)}
        </Button>
        <p className="text-sm text-ink-faint">
          Standing authorisation: {formatCents(Math.max(0, standingLeft))} of {formatCents(view.limits.standingAuthorisationCents)} left on this work order.
        </p>
      </div>
    </div>
  );
}
