import { Money } from "@/components/ui/money";

export interface TotalsData {
  approvedCents: number;
  pendingCents: number;
  declinedCents: number;
  heldCents: number;
  shopSuppliesCents: number;
  taxCents: number;
  grandTotalCents: number;
}

/** Totals per state, and what the approved work comes to with shop supplies and tax. */
export function TotalsBar({
  totals,
  draftCents,
  ifAllPendingApprovedCents,
  taxExempt,
}: {
  totals: TotalsData;
  draftCents?: number;
  ifAllPendingApprovedCents?: number;
  taxExempt?: boolean;
}) {
  const cells: [string, number][] = [
    ["Approved", totals.approvedCents],
    ["Waiting on decision", totals.pendingCents],
    ["Held for later", totals.heldCents],
    ["Declined", totals.declinedCents],
  ];
  if (draftCents) cells.push(["Draft (not sent)", draftCents]);
  return (
    <div className="rounded-card border border-rule bg-paper p-3" data-testid="totals">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-5">
        {cells.map(([label, cents]) => (
          <div key={label}>
            <dt className="text-ink-faint">{label}</dt>
            <dd className="text-base font-semibold">
              <Money cents={cents} />
            </dd>
          </div>
        ))}
      </dl>
      <dl className="mt-3 grid grid-cols-[1fr_auto] gap-x-4 border-t border-rule pt-2 text-sm">
        <dt>Approved work</dt>
        <dd className="text-right">
          <Money cents={totals.approvedCents} />
        </dd>
        <dt>Shop supplies</dt>
        <dd className="text-right">
          <Money cents={totals.shopSuppliesCents} />
        </dd>
        <dt>{taxExempt ? "Tax (exempt)" : "Tax"}</dt>
        <dd className="text-right">
          <Money cents={totals.taxCents} />
        </dd>
        <dt className="font-bold">Total approved</dt>
        <dd className="text-right text-lg font-bold" data-testid="grand-total">
          <Money cents={totals.grandTotalCents} />
        </dd>
        {ifAllPendingApprovedCents !== undefined && totals.pendingCents > 0 ? (
          <>
            <dt className="text-ink-faint">If everything waiting is approved</dt>
            <dd className="text-right text-ink-faint">
              <Money cents={ifAllPendingApprovedCents} />
            </dd>
          </>
        ) : null}
      </dl>
    </div>
  );
}
