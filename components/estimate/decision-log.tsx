import { Money } from "@/components/ui/money";
import { DECISION_LABELS, type Decision } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";

export interface DecisionLogEntry {
  lineId: string;
  decision: Decision;
  by: string;
  at: string;
  amountCents: number;
  lineVersion: number;
  note: string;
}

/** Every decision ever made on this work order: who, when, what, at which amount and line version. */
export function DecisionLog({ entries, describe }: { entries: DecisionLogEntry[]; describe: (lineId: string) => string }) {
  if (!entries.length) return <p className="text-sm text-ink-faint">No decisions yet.</p>;
  return (
    <>
      {/* On a phone the decision and amount lead each entry; a wide table would hide them off to the side. */}
      <ul className="divide-y divide-rule text-sm sm:hidden" data-testid="decision-log-list">
        {entries.map((e, i) => (
          <li key={`${e.lineId}-${i}`} className="py-2">
            <p className="flex justify-between gap-3 font-semibold">
              <span>{DECISION_LABELS[e.decision]}</span>
              <Money cents={e.amountCents} />
            </p>
            <p>
              {describe(e.lineId)} <span className="text-xs text-ink-faint">v{e.lineVersion}</span>
            </p>
            {e.note ? <p className="text-xs text-ink-soft">“{e.note}”</p> : null}
            <p className="text-xs text-ink-faint">
              {e.by} · {formatDateTime(e.at)}
            </p>
          </li>
        ))}
      </ul>
      <div className="hidden overflow-x-auto sm:block">
        <table className="w-full min-w-[36rem] text-sm" data-testid="decision-log">
          <thead>
            <tr className="text-left text-ink-faint">
              <th className="py-1 font-semibold">When</th>
              <th className="py-1 font-semibold">Who</th>
              <th className="py-1 font-semibold">Line</th>
              <th className="py-1 font-semibold">Decision</th>
              <th className="py-1 text-right font-semibold">Amount</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-rule">
            {entries.map((e, i) => (
              <tr key={`${e.lineId}-${i}`}>
                <td className="py-1 whitespace-nowrap">{formatDateTime(e.at)}</td>
                <td className="py-1">{e.by}</td>
                <td className="py-1">
                  {describe(e.lineId)} <span className="text-xs text-ink-faint">v{e.lineVersion}</span>
                  {e.note ? <span className="block text-xs text-ink-soft">“{e.note}”</span> : null}
                </td>
                <td className="py-1">{DECISION_LABELS[e.decision]}</td>
                <td className="py-1 text-right">
                  <Money cents={e.amountCents} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
