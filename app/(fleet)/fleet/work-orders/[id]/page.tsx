import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { approvalData, serverPartsKey } from "@/components/approval/approval-data";
import { ApprovalView } from "@/components/approval/approval-view";
import { FindingCard } from "@/components/findings/finding-card";
import { FindingList } from "@/components/findings/finding-list";
import { Card, CardTitle } from "@/components/ui/card";
import { Timeline } from "@/components/work-order/timeline";
import { WorkOrderHeader } from "@/components/work-order/wo-header";
import { getDb } from "@/db/client";
import { accounts } from "@/db/schema";
import { higherLimitApprovers } from "@/db/queries/pass-on";
import { workOrderView } from "@/db/queries/work-order-view";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { PAGE_SIZE } from "@/lib/http/pagination";
import { READING_CAUTION } from "@/lib/specs";
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
  // Findings (Markdown notes, readings) and the timeline are rendered here, on the server: the
  // browser gets them once, as HTML, and no Markdown renderer. The client part keeps lines live.
  const outOfService = view.findings.filter((f) => f.severity === "out_of_service");
  const others = view.findings.filter((f) => f.severity !== "out_of_service");
  return (
    <>
      <WorkOrderHeader wo={view} unitHref={`/fleet/units/${view.unitId}`} />
      <ApprovalView
        initial={approvalData(view)}
        canDecide={user.role === "approver"}
        taxExempt={account?.taxExempt ?? false}
        colleagues={colleagues}
        partsKey={serverPartsKey(view)}
        pageSize={PAGE_SIZE}
        outOfService={
          <>
            {outOfService.length ? (
              <section aria-labelledby="oos-heading" className="flex flex-col gap-2">
                <h2 id="oos-heading" className="text-lg font-bold">
                  Out of service
                </h2>
                <FindingList findings={outOfService} />
              </section>
            ) : null}
            {!outOfService.some((f) => f.readings.length) && others.some((f) => f.readings.length) ? (
              <p role="note" className="border-l-4 border-ink pl-3 text-sm text-ink-soft">
                {READING_CAUTION}
              </p>
            ) : null}
          </>
        }
        findingCards={Object.fromEntries(others.map((f) => [f.id, <FindingCard key={f.id} finding={f} />]))}
        timeline={
          <Card>
            <CardTitle>Updates from the shop</CardTitle>
            <Timeline entries={view.timeline} />
          </Card>
        }
      />
    </>
  );
}
