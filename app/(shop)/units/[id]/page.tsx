import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { UnitIntermittentConcerns } from "@/components/occurrences/unit-intermittent-concerns";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { StatusPill } from "@/components/ui/status-pill";
import { DeferredWork } from "@/components/units/deferred-work";
import { MeterList } from "@/components/units/meter-list";
import { MeterReadingForm } from "@/components/units/meter-reading-form";
import { UnitFacts } from "@/components/units/unit-facts";
import { WorkOrderHistory } from "@/components/units/work-order-history";
import { ChangeLog } from "@/components/accounts/change-log";
import { ButtonLink } from "@/components/ui/button";
import { Pager } from "@/components/ui/pager";
import { auditTrail } from "@/db/queries/audit";
import { getUnitDetail } from "@/db/queries/units";
import { decodeCursor, PAGE_SIZE } from "@/lib/http/pagination";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { workOrderLabel } from "@/lib/domain";
import { calendarDate } from "@/lib/format";

export const metadata: Metadata = { title: "Unit" };

export default async function ShopUnitPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ cursor?: string; page?: string }>;
}) {
  const user = await requirePageRole(CAN.shopStaff);
  const { id } = await params;
  const sp = await searchParams;
  const cursor = decodeCursor(sp.cursor, 2) ? sp.cursor : undefined;
  const detail = await getUnitDetail(user, id, { visits: { limit: PAGE_SIZE, cursor } });
  if (!detail) notFound();
  const { unit, openWorkOrder, readings, history, historyNextCursor, deferred } = detail;
  const canEdit = hasRole(user, CAN.manageAccounts);
  const changes = canEdit ? await auditTrail("unit", unit.id) : [];
  return (
    <>
      <PageHeader title={`Unit ${unit.unitNumber}`} kicker={unit.retiredAt ? `${unit.accountName} · retired` : unit.accountName}>
        {openWorkOrder ? <StatusPill status={openWorkOrder.status} /> : <StatusPill status={null} />}
        {canEdit && !openWorkOrder && !unit.retiredAt ? <ButtonLink href={`/work-orders/new?unitId=${unit.id}`}>Check in</ButtonLink> : null}
        {canEdit ? (
          <ButtonLink href={`/units/${unit.id}/edit`} variant="secondary">
            Edit
          </ButtonLink>
        ) : null}
      </PageHeader>
      <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>About this unit</CardTitle>
            <UnitFacts unit={unit} today={calendarDate(new Date())} />
          </Card>
          {openWorkOrder ? (
            <Card>
              <CardTitle>In the shop now</CardTitle>
              <p>
                <Link href={`/work-orders/${openWorkOrder.id}`} className="font-semibold">
                  {workOrderLabel(openWorkOrder.number)} · {openWorkOrder.title}
                </Link>
              </p>
            </Card>
          ) : null}
          <UnitIntermittentConcerns unitId={unit.id} />
          <Card aria-labelledby="visits">
            <CardTitle id="visits">Visits</CardTitle>
            <WorkOrderHistory rows={history} hrefFor={(woId) => `/work-orders/${woId}`} />
            <Pager base={`/units/${unit.id}`} label="Pages of visits" params={{ cursor, page: sp.page }} nextCursor={historyNextCursor} hash="#visits" />
          </Card>
        </div>
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>Deferred work</CardTitle>
            <DeferredWork rows={deferred} />
          </Card>
          {canEdit ? (
            <Card>
              <CardTitle>Changes</CardTitle>
              <ChangeLog entries={changes} />
            </Card>
          ) : null}
          <Card>
            <CardTitle>Meter readings</CardTitle>
            <MeterReadingForm unitId={unit.id} />
            <div className="mt-4">
              <MeterList rows={readings} />
            </div>
          </Card>
        </div>
      </div>
    </>
  );
}
