import type { Metadata } from "next";
import { FloorBoard } from "@/components/floor/floor-board";
import { PageHeader } from "@/components/ui/page-header";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { requirePageRole } from "@/lib/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Floor" };

export default async function FloorPage() {
  const user = await requirePageRole(CAN.shopStaff);
  const initial = await listOpenWorkOrders(user, { limit: 200 });
  return (
    <>
      <PageHeader title="Floor" kicker={`${initial.workOrders.length} units in the shop`} />
      <FloorBoard initial={initial} userId={user.id} isTech={user.role === "tech"} />
    </>
  );
}
