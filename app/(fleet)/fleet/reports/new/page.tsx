import type { Metadata } from "next";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { DefectReportForm } from "@/components/reports/defect-report-form";
import { listUnits } from "@/db/queries/units";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Report a defect" };

export default async function NewDefectReportPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.fleet);
  const { unitId = "" } = await searchParams;
  const { units } = await listUnits(user, { limit: 200 });
  return (
    <>
      <PageHeader title="Report a defect" kicker="To the shop" />
      <Card>
        <DefectReportForm units={units} initialUnitId={units.some((u) => u.id === unitId) ? unitId : ""} reporter={user.name} />
      </Card>
    </>
  );
}
