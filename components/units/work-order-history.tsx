import Link from "next/link";
import { StatusPill } from "@/components/ui/status-pill";
import { workOrderLabel, type WorkOrderStatus } from "@/lib/domain";
import { formatDate } from "@/lib/format";

export interface HistoryRow {
  id: string;
  number: number;
  status: WorkOrderStatus;
  title: string;
  openedAt: string;
  releasedAt: string | null;
  technicianName: string | null;
}

export function WorkOrderHistory({ rows, hrefFor }: { rows: HistoryRow[]; hrefFor?: (id: string) => string }) {
  if (!rows.length) return <p className="text-ink-faint">No visits yet.</p>;
  return (
    <ol className="divide-y divide-rule">
      {rows.map((r) => (
        <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
          <div>
            <p className="font-semibold">
              {hrefFor ? <Link href={hrefFor(r.id)}>{workOrderLabel(r.number)}</Link> : workOrderLabel(r.number)} · {r.title}
            </p>
            <p className="text-sm text-ink-faint">
              {formatDate(r.openedAt)}
              {r.releasedAt ? ` – ${formatDate(r.releasedAt)}` : ""}
              {r.technicianName ? ` · ${r.technicianName}` : ""}
            </p>
          </div>
          <StatusPill status={r.status} size="sm" />
        </li>
      ))}
    </ol>
  );
}
