import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { UnitList } from "@/components/units/unit-list";
import { CheckInForm } from "@/components/visits/check-in-form";
import { getDb } from "@/db/client";
import { deferredLinesForUnit } from "@/db/queries/estimate-lines";
import { assignableStaff } from "@/db/queries/people";
import { getServiceRequest } from "@/db/queries/service-requests";
import { deferredOffers } from "@/db/queries/shop-work-order-page";
import { getUnitDetail, listUnits } from "@/db/queries/units";
import { accounts } from "@/db/schema";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { workOrderLabel } from "@/lib/domain";
import { defectComplaint } from "@/lib/service-requests";
import { eq } from "drizzle-orm";

export const metadata: Metadata = { title: "Check a unit in" };

export default async function CheckInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.manageAccounts);
  const p = await searchParams;
  const request = p.serviceRequestId ? await getServiceRequest(user, p.serviceRequestId) : null;
  if (p.serviceRequestId && !request) notFound();
  const unitId = request?.unitId ?? p.unitId;

  if (!unitId) {
    const found = p.q ? await listUnits(user, { limit: 20, q: p.q.slice(0, 100) }) : null;
    return (
      <>
        <PageHeader title="Check a unit in" kicker="Find the unit first" />
        <form method="get" action="/work-orders/new" role="search" className="mb-4 flex gap-2">
          <label className="sr-only" htmlFor="q">
            Find the unit
          </label>
          <input id="q" name="q" type="search" defaultValue={p.q} placeholder="Unit number, part of the VIN, plate, account" className={`${inputClass} flex-1`} />
          <Button type="submit">Find</Button>
        </form>
        {found ? (
          <UnitList units={found.units} showAccount unitHref={(id) => `/units/${id}`} visitHref={(id) => `/work-orders/${id}`} checkInHref={(id) => `/work-orders/new?unitId=${id}`} empty={<Link href="/units/new">Not there? Add the unit.</Link>} />
        ) : null}
      </>
    );
  }

  const detail = await getUnitDetail(user, unitId);
  if (!detail) notFound();
  const { unit, openWorkOrder, readings } = detail;
  const header = <PageHeader title={`Check in ${unit.unitNumber}`} kicker={`${unit.accountName} · ${unit.year ?? ""} ${unit.description}`} />;
  if (openWorkOrder) {
    return (
      <>
        {header}
        <Card>
          <p role="alert" className="font-semibold">
            {unit.unitNumber} is already in the shop on {workOrderLabel(openWorkOrder.number)}. One open work order per unit: add any new concern to that visit.
          </p>
          <p className="mt-2">
            <Link href={`/work-orders/${openWorkOrder.id}`} className="font-bold">
              Open {workOrderLabel(openWorkOrder.number)}
            </Link>
          </p>
        </Card>
      </>
    );
  }
  if (unit.retiredAt) {
    return (
      <>
        {header}
        <Card>
          <p role="alert">{unit.unitNumber} is retired. Put it back in service on its page first.</p>
        </Card>
      </>
    );
  }
  const db = getDb();
  const [staff, deferred, [account]] = await Promise.all([
    assignableStaff(),
    deferredLinesForUnit(db, unit.id, ""),
    db.select({ poRequired: accounts.poRequired }).from(accounts).where(eq(accounts.id, unit.accountId)).limit(1),
  ]);
  const last = (kind: "odometer" | "engine_hours") => readings.find((r) => r.kind === kind)?.value ?? null;
  return (
    <>
      {header}
      {request ? (
        <Card className="mb-4">
          <CardTitle>From {request.reporterName}&apos;s defect report</CardTitle>
          <p className="text-sm text-ink-soft">Its defects are the visit&apos;s first concerns below; change the words if you like.</p>
          {request.note ? <p className="mt-1">“{request.note}”</p> : null}
        </Card>
      ) : null}
      <Card>
        <CheckInForm
          setup={{
            unitId: unit.id,
            unitNumber: unit.unitNumber,
            serviceRequestId: request?.id ?? null,
            complaints: request ? request.defects.map((d) => defectComplaint(d, request.reporterName)) : [],
            staff,
            lastOdometer: last("odometer"),
            lastEngineHours: last("engine_hours"),
            odometer: request?.odometer ? String(request.odometer) : "",
            engineHours: request?.engineHours ? String(request.engineHours) : "",
            poRequired: account?.poRequired ?? false,
            deferred: deferredOffers(deferred),
          }}
        />
      </Card>
    </>
  );
}
