import { Money } from "@/components/ui/money";
import { LINE_STATE_LABELS, type LineState } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { lineAmountCents } from "@/lib/money";

export interface DeferredRow {
  id: string;
  description: string;
  quantityMilli: number;
  unitPriceCents: number;
  state: LineState;
  updatedAt: string;
}

/** Held and declined lines stay on the unit until a later visit brings them back. */
export function DeferredWork({ rows }: { rows: DeferredRow[] }) {
  if (!rows.length) return <p className="text-ink-faint">Nothing deferred.</p>;
  return (
    <ul className="divide-y divide-rule">
      {rows.map((r) => (
        <li key={r.id} className="flex items-baseline justify-between gap-3 py-2">
          <div>
            <p className="font-semibold">{r.description}</p>
            <p className="text-sm text-ink-faint">
              {LINE_STATE_LABELS[r.state]} · {formatDate(r.updatedAt)}
            </p>
          </div>
          <Money cents={lineAmountCents(r.quantityMilli, r.unitPriceCents)} />
        </li>
      ))}
    </ul>
  );
}
