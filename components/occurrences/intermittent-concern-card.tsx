import Link from "next/link";
import { listOccurrences } from "@/db/queries/occurrences";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { CloseConcernForm } from "./close-concern-form";
import { ConcernLogPanel } from "./concern-log-panel";
import { MarkIntermittentForm } from "./mark-intermittent-form";

export interface ConcernCardData {
  id: string;
  unitId: string;
  workOrderId: string | null;
  workOrderNumber?: number | null;
  complaint: string;
  recordHint: string;
  closedAt: string | null;
  conclusion: string;
}

/** One intermittent concern for the shop: what the fleet is asked to record, the live log, and closing it. */
export async function IntermittentConcernCard({ user, concern, showTitle = true, raisedOnOtherVisit = false }: { user: SessionUser; concern: ConcernCardData; showTitle?: boolean; raisedOnOtherVisit?: boolean }) {
  const initial = await listOccurrences(user, concern.unitId, { limit: 200, concernId: concern.id });
  return (
    <article id={`concern-${concern.id}`} className="flex flex-col gap-4" data-testid="intermittent-concern">
      {showTitle ? (
        <header>
          <p className="text-xs font-semibold tracking-wide text-ink-faint uppercase">
            Intermittent{concern.closedAt ? ` · closed ${formatDate(concern.closedAt)}` : " · open on the unit"}
            {raisedOnOtherVisit && concern.workOrderNumber ? ` · raised on ${workOrderLabel(concern.workOrderNumber)}` : ""}
          </p>
          <h3 className="text-lg font-bold">
            <Link href={`/concerns/${concern.id}`}>{concern.complaint}</Link>
          </h3>
        </header>
      ) : null}
      {concern.closedAt ? (
        <div className="rounded-card border-2 border-ink bg-paper p-3" data-testid="concern-conclusion">
          <p className="text-sm font-semibold text-ink-faint">Cause found</p>
          <p>{concern.conclusion}</p>
        </div>
      ) : (
        <div className="rounded-card bg-paper-deep p-3">
          <p className="text-sm font-semibold text-ink-faint">The fleet is asked to record</p>
          <p>{concern.recordHint || "Nothing specific yet."}</p>
          <details className="mt-1">
            <summary className="min-h-touch cursor-pointer py-2 text-sm font-semibold">Change what to record</summary>
            <MarkIntermittentForm concernId={concern.id} currentHint={concern.recordHint} submitLabel="Save" />
          </details>
        </div>
      )}
      <ConcernLogPanel unitId={concern.unitId} concernId={concern.id} initial={initial} />
      {concern.closedAt ? null : <CloseConcernForm concernId={concern.id} />}
    </article>
  );
}
