import { StatusPill } from "@/components/ui/status-pill";
import type { WorkOrderStatus } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";

export interface TimelineEntry {
  id: string;
  status: WorkOrderStatus;
  note: string;
  at: string;
  by: string | null;
}

/** Dated updates posted by the shop, newest first. */
export function Timeline({ entries }: { entries: TimelineEntry[] }) {
  if (!entries.length) return <p className="text-ink-faint">No updates yet.</p>;
  return (
    <ol className="relative flex flex-col gap-3 border-l-2 border-rule pl-4" data-testid="timeline">
      {entries.map((e) => (
        <li key={e.id} className="relative">
          <span aria-hidden className="absolute top-2 -left-[1.4rem] size-3 rounded-full border-2 border-ink bg-paper-card" />
          <div className="flex flex-wrap items-center gap-2">
            <StatusPill status={e.status} size="sm" />
            {/* Date and person wrap together, so a phone never shows a stray "· name" line. */}
            <span className="text-sm text-ink-faint">
              <time className="figures" dateTime={e.at}>
                {formatDateTime(e.at)}
              </time>
              {e.by ? ` · ${e.by}` : null}
            </span>
          </div>
          {e.note ? <p className="mt-1">{e.note}</p> : null}
        </li>
      ))}
    </ol>
  );
}
