import { daysSincePhrase, type PatternSummary } from "@/lib/occurrences/pattern";

/** The counts in words, and the days since the last one as the big number. */
export function PatternSummaryView({ summary }: { summary: PatternSummary }) {
  return (
    <div className="grid gap-3 sm:grid-cols-[1fr_auto]">
      <div>
        <p className="text-lg leading-snug font-bold" data-testid="pattern-headline">
          {keepUnitsTogether(summary.headline)}
        </p>
        <ul className="mt-1 flex flex-col gap-0.5 text-sm text-ink-soft">
          {summary.lines.map((l) => (
            <li key={l}>{keepUnitsTogether(l)}</li>
          ))}
        </ul>
      </div>
      <dl className="flex gap-4 sm:flex-col sm:gap-2 sm:text-right">
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-faint uppercase">Logged</dt>
          <dd className="figures text-2xl font-bold" data-testid="occurrence-count">
            {summary.total}
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-faint uppercase">Last one</dt>
          <dd className="figures text-2xl font-bold" data-testid="days-since-last">
            {daysSincePhrase(summary.daysSinceLast)}
          </dd>
        </div>
      </dl>
    </div>
  );
}

/** "25 °F" and "10 h" never break across lines. */
function keepUnitsTogether(text: string): string {
  return text.replace(/(\d) (°[FC]|h\b|V\b)/g, "$1\u00a0$2");
}
