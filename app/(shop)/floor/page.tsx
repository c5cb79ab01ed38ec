import type { Metadata } from "next";
import Link from "next/link";
import { FloorBoard } from "@/components/floor/floor-board";
import { ReportList } from "@/components/reports/report-list";
import { ButtonLink } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { hasAccounts } from "@/db/queries/accounts";
import { listServiceRequests } from "@/db/queries/service-requests";
import { floorLanes } from "@/db/queries/work-order-list";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Floor" };

export default async function FloorPage() {
  const user = await requirePageRole(CAN.shopStaff);
  const [floor, reports, anyAccount] = await Promise.all([
    floorLanes(user, { mineFor: user.role === "tech" ? user.id : undefined }),
    listServiceRequests(user, { limit: 50, status: "open" }),
    hasAccounts(),
  ]);
  const canCheckIn = hasRole(user, CAN.manageAccounts);
  // The board is drawn at request time (and again on each refresh): "late" is against this instant.
  const renderedAt = new Date().getTime();
  return (
    <>
      <PageHeader title="Floor" kicker={`${floor.total} unit${floor.total === 1 ? "" : "s"} in the shop`}>
        {canCheckIn ? <ButtonLink href="/work-orders/new">Check a unit in</ButtonLink> : null}
      </PageHeader>
      {canCheckIn && !anyAccount ? (
        <Card className="mb-4" data-testid="first-steps">
          <CardTitle>Getting started</CardTitle>
          <ol className="list-decimal pl-5">
            {user.role === "owner" ? (
              <li>
                <Link href="/settings/people">Invite your service writers and technicians</Link>.
              </li>
            ) : null}
            <li>
              <Link href="/accounts/new">Create a fleet account</Link> and invite its approver.
            </li>
            <li>Add its units one by one or from a CSV file.</li>
            <li>Check the first unit in.</li>
          </ol>
        </Card>
      ) : null}
      {reports.serviceRequests.length ? (
        <section id="defect-reports" aria-labelledby="defect-reports-title" className="mb-6">
          <h2 id="defect-reports-title" className="mb-2 text-xl font-bold">
            Defect reports waiting <span className="figures text-ink-faint">({reports.serviceRequests.length})</span>
          </h2>
          <ReportList rows={reports.serviceRequests} shop={canCheckIn} empty="" />
        </section>
      ) : null}
      <FloorBoard floor={floor} userId={user.id} isTech={user.role === "tech"} renderedAt={renderedAt} />
    </>
  );
}
