import { Card, CardTitle } from "@/components/ui/card";
import { markableConcerns } from "@/db/queries/intermittent-concerns";
import { unitIntermittentConcerns } from "@/db/queries/occurrences";
import { requireUser } from "@/lib/server/auth/current-user";
import { CAN, hasRole } from "@/lib/auth/policy";
import { IntermittentConcernCard } from "./intermittent-concern-card";
import { MarkIntermittentForm } from "./mark-intermittent-form";

/**
 * The occurrence log on a work order: every intermittent concern open on the
 * unit (whichever visit raised it), those closed on this visit, and a way to
 * mark one of this visit's concerns intermittent.
 */
export async function WorkOrderOccurrences({ workOrderId, unitId }: { workOrderId: string; unitId: string }) {
  const user = await requireUser();
  const [all, markable] = await Promise.all([unitIntermittentConcerns(unitId), markableConcerns(workOrderId)]);
  const shown = all.filter((c) => !c.closedAt || c.workOrderId === workOrderId);
  const canMark = hasRole(user, CAN.postFindings);
  if (!shown.length && !(canMark && markable.length)) return null;
  return (
    <Card data-testid="work-order-occurrences">
      <CardTitle>Occurrence log</CardTitle>
      <div className="flex flex-col gap-6">
        {shown.map((c) => (
          <IntermittentConcernCard key={c.id} user={user} concern={c} raisedOnOtherVisit={c.workOrderId !== workOrderId} />
        ))}
        {canMark && markable.length ? (
          <details open={!shown.length}>
            <summary className="min-h-touch cursor-pointer py-2 font-bold">A concern comes and goes? Ask the fleet to log it</summary>
            <MarkIntermittentForm concerns={markable} />
          </details>
        ) : null}
      </div>
    </Card>
  );
}
