import type { Metadata } from "next";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { UnitForm } from "@/components/units/unit-form";
import { accountChoices } from "@/db/queries/accounts";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Add a unit" };

export default async function NewUnitPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  await requirePageRole(CAN.manageAccounts);
  const { accountId = "" } = await searchParams;
  const accounts = await accountChoices();
  return (
    <>
      <PageHeader title="Add a unit" kicker={accounts.find((a) => a.id === accountId)?.name ?? "Units"} />
      <Card>
        <UnitForm
          accounts={accounts}
          initial={{ unitId: "", accountId, unitNumber: "", vin: "", serialOnly: false, serial: "", year: "", description: "", plate: "", lastInspectionOn: "", inspectionBasis: "", keyOffDrainLimitMa: "", lastOdometer: null, lastEngineHours: null }}
        />
      </Card>
    </>
  );
}
