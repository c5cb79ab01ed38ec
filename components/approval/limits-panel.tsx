import { Money } from "@/components/ui/money";

export interface LimitsData {
  signingLimitCents: number | null;
  signingUsedCents: number | null;
  budgetCents: number | null;
  budgetRemainingCents: number | null;
  budgetUsedCents: number;
  fiscalYear: string;
  standingAuthorisationCents: number;
}

function Bar({ used, total, label }: { used: number; total: number; label: string }) {
  const percent = total > 0 ? Math.min(100, Math.round((used / total) * 100)) : 100;
  return (
    <div role="img" aria-label={`${label}: ${percent}% used`} className="mt-1 h-3 overflow-hidden rounded-full border border-ink bg-paper">
      <div className={`h-full ${percent >= 90 ? "bg-rust" : "bg-ink-soft"}`} style={{ width: `${percent}%` }} />
    </div>
  );
}

/**
 * The approver's own signing limit on this work order and the account's budget this fiscal year.
 * A released visit takes no more decisions, so it shows no signing limit "left" to spend on it.
 */
export function LimitsPanel({ limits, closed = false }: { limits: LimitsData; closed?: boolean }) {
  const signingLeft = limits.signingLimitCents !== null ? limits.signingLimitCents - (limits.signingUsedCents ?? 0) : null;
  return (
    <div className="grid gap-3 sm:grid-cols-2" data-testid="limits">
      {closed ? (
        <div className="rounded-card border border-rule bg-paper p-3 text-sm" data-testid="visit-closed">
          <p className="font-semibold">This visit is released: nothing on it waits for a decision.</p>
          {limits.signingUsedCents ? (
            <p className="mt-1 text-ink-soft">
              You approved <Money cents={limits.signingUsedCents} /> on it.
            </p>
          ) : null}
        </div>
      ) : limits.signingLimitCents !== null ? (
        <div className="rounded-card border border-rule bg-paper p-3">
          <p className="text-sm text-ink-faint">Your signing limit on this work order</p>
          <p className="text-lg font-bold">
            <Money cents={limits.signingUsedCents ?? 0} /> used of <Money cents={limits.signingLimitCents} />
          </p>
          <Bar used={limits.signingUsedCents ?? 0} total={limits.signingLimitCents} label="Signing limit" />
          <p className="mt-1 text-sm" data-testid="signing-left">
            <Money cents={Math.max(0, signingLeft ?? 0)} /> left
          </p>
        </div>
      ) : null}
      {limits.budgetCents !== null ? (
        <div className="rounded-card border border-rule bg-paper p-3">
          <p className="text-sm text-ink-faint">Repair budget, {limits.fiscalYear}</p>
          <p className="text-lg font-bold">
            <Money cents={limits.budgetUsedCents} /> used of <Money cents={limits.budgetCents} />
          </p>
          <Bar used={limits.budgetUsedCents} total={limits.budgetCents} label="Repair budget" />
          <p className="mt-1 text-sm" data-testid="budget-left">
            <Money cents={Math.max(0, limits.budgetRemainingCents ?? 0)} /> left this fiscal year
          </p>
        </div>
      ) : (
        <div className="rounded-card border border-rule bg-paper p-3 text-sm text-ink-soft">No repair budget is set for this account.</div>
      )}
    </div>
  );
}
