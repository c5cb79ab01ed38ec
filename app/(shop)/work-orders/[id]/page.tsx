import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { WorkOrderFindings } from "@/components/findings/work-order-findings";
import { Card, CardTitle } from "@/components/ui/card";
import { ConcernList } from "@/components/work-order/concern-list";
import { StatusMover } from "@/components/work-order/status-mover";
import { Timeline } from "@/components/work-order/timeline";
import { WorkOrderHeader } from "@/components/work-order/wo-header";
import { findWorkOrder, loadConcerns, loadFindings, loadTimeline } from "@/db/queries/work-order-detail";
import { requireUser } from "@/lib/auth/current-user";
import { CAN, hasRole } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Work order" };

export default async function ShopWorkOrderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireUser();
  const wo = await findWorkOrder(user, id);
  if (!wo) notFound();
  const [timeline, concerns, findings] = await Promise.all([loadTimeline(wo.id), loadConcerns(wo.id), loadFindings(wo.id)]);
  return (
    <>
      <WorkOrderHeader wo={wo} unitHref={`/units/${wo.unitId}`} />
      <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
        <div className="flex flex-col gap-4">
          <WorkOrderFindings workOrderId={wo.id} findings={findings} canAdd={wo.status !== "released" && hasRole(user, CAN.postFindings)} />
          <Card>
            <CardTitle>Concerns</CardTitle>
            <ConcernList concerns={concerns} />
          </Card>
        </div>
        <div className="flex flex-col gap-4">
          {hasRole(user, CAN.moveStatus) ? (
            <Card>
              <CardTitle>Move this unit</CardTitle>
              <StatusMover workOrderId={wo.id} status={wo.status} unitNumber={wo.unitNumber} />
            </Card>
          ) : null}
          <Card>
            <CardTitle>Timeline</CardTitle>
            <Timeline entries={timeline} />
          </Card>
        </div>
      </div>
    </>
  );
}
