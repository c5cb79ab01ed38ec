import { Money } from "@/components/ui/money";

/** How much of an account's repair budget this fiscal year is spoken for, as a bar and in figures. */
export function BudgetBar({ usedCents, budgetCents, label }: { usedCents: number; budgetCents: number | null; label: string }) {
  if (budgetCents === null) return <p className="text-sm text-ink-faint">No repair budget set · {label}</p>;
  const percent = budgetCents > 0 ? Math.min(100, Math.round((usedCents / budgetCents) * 100)) : 100;
  return (
    <div>
      <div className="flex justify-between text-sm">
        <span>
          <Money cents={usedCents} /> of <Money cents={budgetCents} /> · {label}
        </span>
        <span className="figures font-semibold">{percent}%</span>
      </div>
      <div role="img" aria-label={`${percent}% of the repair budget used`} className="mt-1 h-3 overflow-hidden rounded-full border border-ink bg-paper">
        <div className={`h-full ${percent >= 90 ? "bg-rust" : "bg-ink-soft"}`} style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}
