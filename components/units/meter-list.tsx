import { formatDate, formatNumber } from "@/lib/format";
import type { MeterKind } from "@/lib/domain";
import { METER_LABELS, METER_UNITS } from "@/lib/meters";

export interface MeterRow {
  id: string;
  kind: MeterKind;
  value: number;
  meterReplaced: boolean;
  readAt: string;
}

export function MeterList({ rows }: { rows: MeterRow[] }) {
  if (!rows.length) return <p className="text-ink-faint">No readings yet.</p>;
  return (
    <table className="w-full text-sm">
      <thead>
        <tr className="text-left text-ink-faint">
          <th className="py-1 font-semibold">Date</th>
          <th className="py-1 font-semibold">Meter</th>
          <th className="py-1 text-right font-semibold">Reading</th>
        </tr>
      </thead>
      <tbody className="divide-y divide-rule">
        {rows.map((r) => (
          <tr key={r.id}>
            <td className="py-1">{formatDate(r.readAt)}</td>
            <td className="py-1">
              {METER_LABELS[r.kind]}
              {r.meterReplaced ? <span className="ml-1 text-rust-deep">(new meter)</span> : null}
            </td>
            <td className="figures py-1 text-right">
              {formatNumber(r.value, 1)} {METER_UNITS[r.kind]}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
