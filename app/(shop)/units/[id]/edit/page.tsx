import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { RetireUnitButton } from "@/components/units/retire-unit-button";
import { UnitForm } from "@/components/units/unit-form";
import { getUnitDetail } from "@/db/queries/units";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Edit unit" };

export default async function EditUnitPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.manageAccounts);
  const { id } = await params;
  const detail = await getUnitDetail(user, id);
  if (!detail) notFound();
  const { unit, readings } = detail;
  const last = (kind: "odometer" | "engine_hours") => readings.find((r) => r.kind === kind)?.value ?? null;
  return (
    <>
      <PageHeader title={`Edit unit ${unit.unitNumber}`} kicker={unit.accountName} />
      <div className="flex flex-col gap-4">
        <Card>
          <UnitForm
            initial={{
              unitId: unit.id,
              accountId: unit.accountId,
              unitNumber: unit.unitNumber,
              vin: unit.vin ?? "",
              serialOnly: unit.serialOnly,
              serial: unit.serialNumber ?? "",
              year: unit.year ? String(unit.year) : "",
              description: unit.description,
              plate: unit.plate,
              lastInspectionOn: unit.lastInspectionOn ?? "",
              inspectionBasis: unit.inspectionBasis ?? "",
              keyOffDrainLimitMa: unit.keyOffDrainLimitMa ? String(unit.keyOffDrainLimitMa) : "",
              lastOdometer: last("odometer"),
              lastEngineHours: last("engine_hours"),
            }}
          />
        </Card>
        <Card>
          <CardTitle>{unit.retiredAt ? "Retired" : "Retire"}</CardTitle>
          <p className="mb-2 text-sm text-ink-soft">A retired unit keeps its visits and invoices, leaves every list, and gives its unit number back for a replacement.</p>
          <RetireUnitButton unitId={unit.id} retired={unit.retiredAt !== null} />
        </Card>
      </div>
    </>
  );
}
