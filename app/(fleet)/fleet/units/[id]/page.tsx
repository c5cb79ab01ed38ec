import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { LiveVisit, LiveVisitStatus } from "@/components/fleet/live-visit";
import { FleetWatchList } from "@/components/occurrences/fleet-watch-list";
import { Pager } from "@/components/ui/pager";
import { ButtonLink } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { DeferredWork } from "@/components/units/deferred-work";
import { MeterList } from "@/components/units/meter-list";
import { UnitFacts } from "@/components/units/unit-facts";
import { WorkOrderHistory } from "@/components/units/work-order-history";
import { currentVisit } from "@/db/queries/finding-reads";
import { getUnitDetail } from "@/db/queries/units";
import { decodeCursor, PAGE_SIZE } from "@/lib/http/pagination";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { calendarDate } from "@/lib/format";

export const metadata: Metadata = { title: "Unit" };

export default async function FleetUnitPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ cursor?: string; page?: string }>;
}) {
  const user = await requirePageRole(CAN.fleet);
  const { id } = await params;
  const sp = await searchParams;
  const cursor = decodeCursor(sp.cursor, 2) ? sp.cursor : undefined;
  // Scoped to the user's account: another account's unit is simply not found.
  const [detail, visit] = await Promise.all([getUnitDetail(user, id, { visits: { limit: PAGE_SIZE, cursor } }), currentVisit(user, id)]);
  if (!detail || !visit) notFound();
  const { unit, openWorkOrder, readings, history, historyNextCursor, deferred } = detail;
  return (
    <>
      <PageHeader title={`Unit ${unit.unitNumber}`} kicker={unit.description}>
        <LiveVisitStatus unitId={unit.id} initial={visit} />
      </PageHeader>
      <p className="mb-4 flex flex-wrap gap-2">
        {openWorkOrder ? (
          <ButtonLink href={`/fleet/work-orders/${openWorkOrder.id}`} data-testid="open-estimate">
            {openWorkOrder.status === "waiting_approval" ? "Review the estimate and decide" : "See this visit's estimate"}
          </ButtonLink>
        ) : null}
        {unit.retiredAt ? null : (
          <ButtonLink href={`/fleet/reports/new?unitId=${unit.id}`} variant="secondary">
            Report a defect
          </ButtonLink>
        )}
      </p>
      <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
        <div className="flex flex-col gap-4">
          <LiveVisit unitId={unit.id} initial={visit} />
          <FleetWatchList user={user} unitId={unit.id} compact />
          <Card aria-labelledby="visits">
            <CardTitle id="visits">Visits</CardTitle>
            <WorkOrderHistory rows={history} hrefFor={(woId) => `/fleet/work-orders/${woId}`} />
            <Pager base={`/fleet/units/${unit.id}`} label="Pages of visits" params={{ cursor, page: sp.page }} nextCursor={historyNextCursor} hash="#visits" />
          </Card>
          <Card>
            <CardTitle>Deferred work</CardTitle>
            <DeferredWork rows={deferred} />
          </Card>
        </div>
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>About this unit</CardTitle>
            <UnitFacts unit={unit} today={calendarDate(new Date())} />
          </Card>
          <Card>
            <CardTitle>Meter readings</CardTitle>
            <MeterList rows={readings.slice(0, 6)} />
          </Card>
        </div>
      </div>
    </>
  );
}
