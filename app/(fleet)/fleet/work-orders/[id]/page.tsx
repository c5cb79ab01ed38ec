import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ApprovalView } from "@/components/approval/approval-view";
import { DecisionLog } from "@/components/estimate/decision-log";
import { Card, CardTitle } from "@/components/ui/card";
import { Timeline } from "@/components/work-order/timeline";
import { WorkOrderHeader } from "@/components/work-order/wo-header";
import { getDb } from "@/db/client";
import { accounts } from "@/db/schema";
import { workOrderView } from "@/db/queries/work-order-view";
import { requireUser } from "@/lib/auth/current-user";
import { eq } from "drizzle-orm";

export const metadata: Metadata = { title: "Estimate" };

export default async function FleetWorkOrderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireUser();
  // Scoped: another account's work order is simply not found.
  const view = await workOrderView(user, id);
  if (!view) notFound();
  const [account] = await getDb().select({ taxExempt: accounts.taxExempt }).from(accounts).where(eq(accounts.id, view.accountId)).limit(1);
  const describe = (lineId: string) => view.lines.find((l) => l.id === lineId)?.description ?? "Removed line";
  return (
    <>
      <WorkOrderHeader wo={view} unitHref={`/fleet/units/${view.unitId}`} />
      <div className="flex flex-col gap-4">
        <ApprovalView initial={view} canDecide={user.role === "approver"} taxExempt={account?.taxExempt ?? false} />
        <Card>
          <CardTitle>Decisions</CardTitle>
          <DecisionLog entries={view.decisionLog} describe={describe} />
        </Card>
        <Card>
          <CardTitle>Updates from the shop</CardTitle>
          <Timeline entries={view.timeline} />
        </Card>
      </div>
    </>
  );
}
