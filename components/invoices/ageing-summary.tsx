import { Money } from "@/components/ui/money";
import { AGEING_BUCKETS, AGEING_LABELS, type Ageing } from "@/lib/receivables/ageing";

// Older money reads darker; every bucket is also written out with its amount,
// so the bar never carries meaning on its own.
const SHADES = ["bg-rule-strong", "bg-ink-faint", "bg-ink-soft", "bg-rust", "bg-rust-deep"];

/** The five ageing buckets as labelled amounts with one proportional bar. */
export function AgeingSummary({ ageing, totalDueCents }: { ageing: Ageing; totalDueCents: number }) {
  return (
    <div data-testid="ageing">
      {totalDueCents > 0 ? (
        <div className="mb-3 flex h-4 w-full overflow-hidden rounded-full border border-ink" aria-hidden>
          {AGEING_BUCKETS.map((b, i) =>
            ageing[b] > 0 ? <span key={b} className={SHADES[i]} style={{ width: `${(ageing[b] / totalDueCents) * 100}%` }} /> : null,
          )}
        </div>
      ) : null}
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6">
        {AGEING_BUCKETS.map((b, i) => (
          <div key={b} className="rounded-card border border-rule bg-paper-card px-3 py-2" data-bucket={b}>
            <dt className="flex items-center gap-1.5 text-xs text-ink-faint">
              <span aria-hidden className={`inline-block size-2.5 rounded-sm ${SHADES[i]}`} />
              {AGEING_LABELS[b]}
              {b === "current" ? "" : " past due"}
            </dt>
            <dd className="text-lg font-bold">
              <Money cents={ageing[b]} />
            </dd>
          </div>
        ))}
        <div className="rounded-card border-2 border-ink bg-paper-card px-3 py-2">
          <dt className="text-xs font-semibold">Total due</dt>
          <dd className="text-lg font-bold" data-testid="total-due">
            <Money cents={totalDueCents} />
          </dd>
        </div>
      </dl>
    </div>
  );
}
