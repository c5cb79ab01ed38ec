import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { IntermittentConcernCard } from "@/components/occurrences/intermittent-concern-card";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { findConcern, openVisitOf } from "@/db/queries/intermittent-concerns";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { workOrderLabel } from "@/lib/domain";

export const metadata: Metadata = { title: "Occurrence log" };

/** One concern's page: where the occurrence e-mail links. It spans visits, so it lives on its own. */
export default async function ConcernPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.shopStaff);
  const { id } = await params;
  const concern = await findConcern(user, id);
  if (!concern) notFound();
  const visit = await openVisitOf(concern.unitId);
  return (
    <>
      <PageHeader title={concern.complaint} kicker={`Occurrence log · ${concern.unitNumber} · ${concern.accountName}`} />
      <p className="-mt-3 mb-4 flex flex-wrap items-center gap-x-4 text-sm [&>a]:inline-flex [&>a]:min-h-touch [&>a]:items-center">
        <Link href={`/units/${concern.unitId}`}>
          Unit {concern.unitNumber} · {concern.unitDescription}
        </Link>
        {concern.workOrderId && concern.workOrderNumber ? (
          <Link href={`/work-orders/${concern.workOrderId}`}>Raised on {workOrderLabel(concern.workOrderNumber)}</Link>
        ) : null}
        {visit && visit.id !== concern.workOrderId ? (
          <Link href={`/work-orders/${visit.id}`}>In the shop now on {workOrderLabel(visit.number)}</Link>
        ) : null}
        {visit?.technicianName ? <span className="text-ink-faint">Technician: {visit.technicianName}</span> : null}
      </p>
      {concern.intermittent ? (
        <Card>
          <IntermittentConcernCard user={user} concern={concern} showTitle={false} />
        </Card>
      ) : (
        <Card>
          <p>This concern is not marked intermittent, so the fleet is not logging it. Mark it from its work order.</p>
        </Card>
      )}
    </>
  );
}
