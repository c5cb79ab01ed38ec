import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ApprovalView } from "@/components/approval/approval-view";
import { WorkOrderHeader } from "@/components/work-order/wo-header";
import { getDb } from "@/db/client";
import { accounts } from "@/db/schema";
import { higherLimitApprovers } from "@/db/queries/pass-on";
import { workOrderView } from "@/db/queries/work-order-view";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { eq } from "drizzle-orm";

export const metadata: Metadata = { title: "Estimate" };

export default async function FleetWorkOrderPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.fleet);
  const { id } = await params;
  // Scoped: another account's work order is simply not found.
  const view = await workOrderView(user, id);
  if (!view) notFound();
  const colleagues = await higherLimitApprovers(user);
  const [account] = await getDb().select({ taxExempt: accounts.taxExempt }).from(accounts).where(eq(accounts.id, view.accountId)).limit(1);
  return (
    <>
      <WorkOrderHeader wo={view} unitHref={`/fleet/units/${view.unitId}`} />
      <ApprovalView initial={view} canDecide={user.role === "approver"} taxExempt={account?.taxExempt ?? false} colleagues={colleagues} />
    </>
  );
}
