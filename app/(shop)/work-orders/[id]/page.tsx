import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { WorkOrderOccurrences } from "@/components/occurrences/work-order-occurrences";
import { Card, CardTitle } from "@/components/ui/card";
import { ConcernList } from "@/components/work-order/concern-list";
import { Timeline } from "@/components/work-order/timeline";
import { WorkOrderHeader } from "@/components/work-order/wo-header";
import { findWorkOrder, loadConcerns, loadTimeline } from "@/db/queries/work-order-detail";
import { requireUser } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "Work order" };

export default async function ShopWorkOrderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireUser();
  const wo = await findWorkOrder(user, id);
  if (!wo) notFound();
  const [timeline, concerns] = await Promise.all([loadTimeline(wo.id), loadConcerns(wo.id)]);
  return (
    <>
      <WorkOrderHeader wo={wo} unitHref={`/units/${wo.unitId}`} />
      <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>Concerns</CardTitle>
            <ConcernList concerns={concerns} />
          </Card>
          <WorkOrderOccurrences workOrderId={wo.id} unitId={wo.unitId} />
        </div>
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>Timeline</CardTitle>
            <Timeline entries={timeline} />
          </Card>
        </div>
      </div>
    </>
  );
}
