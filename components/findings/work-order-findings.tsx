import { ButtonLink } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import type { FindingView } from "@/db/queries/work-order-detail";
import { FindingList } from "./finding-list";

/** The shop work-order page's findings, with the technician's big "Add a finding" on open visits. */
export function WorkOrderFindings({ workOrderId, findings, canAdd }: { workOrderId: string; findings: FindingView[]; canAdd: boolean }) {
  return (
    <Card aria-labelledby="findings-title" id="findings">
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <CardTitle id="findings-title" className="mb-0">
          Findings <span className="figures text-ink-faint">({findings.length})</span>
        </CardTitle>
        {canAdd ? (
          <ButtonLink href={`/work-orders/${workOrderId}/findings/new`} className="w-full text-lg sm:w-auto">
            + Add a finding
          </ButtonLink>
        ) : null}
      </div>
      <FindingList findings={findings} />
    </Card>
  );
}
