import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DecisionLog } from "@/components/estimate/decision-log";
import { DeferredOfferPanel } from "@/components/estimate/deferred-offer";
import { EstimateEditor } from "@/components/estimate/estimate-editor";
import { TimeClock } from "@/components/estimate/time-clock";
import { WorkOrderFindings } from "@/components/findings/work-order-findings";
import { WorkOrderInvoice } from "@/components/invoices/work-order-invoice";
import { WorkOrderOccurrences } from "@/components/occurrences/work-order-occurrences";
import { Card, CardTitle } from "@/components/ui/card";
import { ConcernList } from "@/components/work-order/concern-list";
import { StatusMover } from "@/components/work-order/status-mover";
import { Timeline } from "@/components/work-order/timeline";
import { WorkOrderHeader } from "@/components/work-order/wo-header";
import { ConcernEditor } from "@/components/visits/concern-editor";
import { VisitDetailsForm } from "@/components/visits/visit-details-form";
import { assignableStaff } from "@/db/queries/people";
import { loadShopWorkOrderPage } from "@/db/queries/shop-work-order-page";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { toLocalDateTimeInput } from "@/lib/dates";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Work order" };

export default async function ShopWorkOrderPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.shopStaff);
  const { id } = await params;
  const page = await loadShopWorkOrderPage(user, id);
  if (!page) notFound();
  const { view } = page;
  const canPrice = hasRole(user, CAN.writeEstimates);
  const open = view.status !== "released";
  const staff = canPrice && open ? await assignableStaff() : [];
  const describe = (lineId: string) => view.lines.find((l) => l.id === lineId)?.description ?? "Removed line";
  return (
    <>
      <WorkOrderHeader wo={view} unitHref={`/units/${view.unitId}`} />
      <div className="flex flex-col gap-4">
        <div className="grid gap-4 lg:grid-cols-2">
          <div className="flex min-w-0 flex-col gap-4">
            <WorkOrderFindings
              workOrderId={view.id}
              findings={view.findings}
              canAdd={view.status !== "released" && hasRole(user, CAN.postFindings)}
            />
            <Card>
              <CardTitle>Concerns: complaint, cause, correction</CardTitle>
              {open && hasRole(user, CAN.moveStatus) ? <ConcernEditor workOrderId={view.id} concerns={view.concerns} /> : <ConcernList concerns={view.concerns} />}
            </Card>
          </div>
          <div className="flex min-w-0 flex-col gap-4">
            {canPrice && open ? (
              <Card>
                <CardTitle>Visit details</CardTitle>
                <VisitDetailsForm
                  workOrderId={view.id}
                  staff={staff}
                  initial={{
                    assignedTechId: view.assignedTechId ?? "",
                    promisedAt: view.promisedAt ? toLocalDateTimeInput(view.promisedAt, env().APP_TIME_ZONE) : "",
                    poNumber: view.poNumber ?? "",
                  }}
                />
              </Card>
            ) : null}
            {hasRole(user, CAN.moveStatus) ? (
              <Card>
                <CardTitle>Move this unit</CardTitle>
                <StatusMover
                  workOrderId={view.id}
                  status={view.status}
                  unitNumber={view.unitNumber}
                  waitingLines={view.lines.filter((l) => l.state === "proposed").length}
                  canSettle={hasRole(user, CAN.writeEstimates)}
                />
              </Card>
            ) : null}
            <Card>
              <CardTitle>Time and progress</CardTitle>
              <TimeClock
                workOrderId={view.id}
                lines={page.clockLines}
                userId={user.id}
                renderedAt={page.renderedAt}
                canAskForMore={view.status !== "released" && canPrice}
              />
            </Card>
            <Card>
              <CardTitle>Timeline</CardTitle>
              <Timeline entries={view.timeline} />
            </Card>
          </div>
        </div>
        <WorkOrderOccurrences workOrderId={view.id} unitId={view.unitId} />
        {canPrice ? (
          <Card>
            <CardTitle>Estimate</CardTitle>
            <div className="flex flex-col gap-4">
              <DeferredOfferPanel workOrderId={view.id} offers={page.deferred} />
              <EstimateEditor view={view} rates={page.rates} taxDefaults={page.taxDefaults} shop={page.shop} account={page.account} taxExempt={page.taxExempt} />
            </div>
          </Card>
        ) : null}
        <WorkOrderInvoice workOrderId={view.id} user={user} />
        <Card>
          <CardTitle>Decisions</CardTitle>
          <DecisionLog entries={view.decisionLog} describe={describe} />
        </Card>
      </div>
    </>
  );
}
