import type { Metadata } from "next";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { ReportList } from "@/components/reports/report-list";
import { Pager } from "@/components/ui/pager";
import { listServiceRequests } from "@/db/queries/service-requests";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { decodeCursor } from "@/lib/http/pagination";

export const metadata: Metadata = { title: "Defect reports" };

export default async function FleetReportsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.fleet);
  const p = await searchParams;
  const cursor = decodeCursor(p.cursor, 2) ? p.cursor : undefined;
  const { serviceRequests, nextCursor } = await listServiceRequests(user, { limit: 50, cursor });
  return (
    <>
      <PageHeader title="Defect reports" kicker="Yours and your colleagues'">
        <ButtonLink href="/fleet/reports/new">Report a defect</ButtonLink>
      </PageHeader>
      <ReportList rows={serviceRequests} shop={false} empty="No defect reports yet." />
      <Pager base="/fleet/reports" params={{ cursor, page: p.page }} nextCursor={nextCursor} />
    </>
  );
}
