import type { Verdict } from "@/lib/domain";
import { formatNumber } from "@/lib/format";
import { READING_KINDS, formatInches, sourceLine, type ReadingKind } from "@/lib/specs";
import { VerdictMark } from "./verdict-mark";

export interface ReadingView {
  id: string;
  kind: string;
  location: string;
  value: number;
  unit: string;
  verdict: Verdict;
  limit: string;
  source: string;
  sourceKind: string;
}

function kindLabel(kind: string): string {
  return kind in READING_KINDS ? READING_KINDS[kind as ReadingKind].label : kind;
}

export function formatReadingValue(value: number, unit: string): string {
  if (unit === "in") return `${formatInches(value)} in`;
  if (unit === "days") return value < 0 ? `${-value} days past due` : `${value} days left`;
  if (unit === "/32 in") return `${formatNumber(value, 2)}/32 in`;
  return `${formatNumber(value, 3)} ${unit}`;
}

/** Each reading: what and where, the number, the verdict in words, the limit used and its source. */
export function ReadingList({ readings }: { readings: readonly ReadingView[] }) {
  if (!readings.length) return null;
  return (
    <ul className="flex flex-col divide-y divide-rule rounded-card border border-rule bg-paper" data-testid="reading-list">
      {readings.map((r) => (
        <li key={r.id} className="flex flex-col gap-1 px-3 py-2" data-testid="reading" data-verdict={r.verdict}>
          <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
            <span className="font-semibold">
              {kindLabel(r.kind)}
              {r.location ? <span className="font-normal text-ink-soft"> · {r.location}</span> : null}
            </span>
            <span className="flex items-center gap-2">
              <span className="figures text-lg font-bold">{formatReadingValue(r.value, r.unit)}</span>
              <VerdictMark verdict={r.verdict} />
            </span>
          </div>
          <p className="text-sm text-ink-soft">
            Limit: <span className="figures">{r.limit}</span>
          </p>
          <p className="text-xs text-ink-faint">
            Source: {sourceLine(r.source, r.sourceKind)}
          </p>
        </li>
      ))}
    </ul>
  );
}
