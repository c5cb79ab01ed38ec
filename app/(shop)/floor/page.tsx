import type { Metadata } from "next";
import { FloorBoard } from "@/components/floor/floor-board";
import { PageHeader } from "@/components/ui/page-header";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { requireUser } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "Floor" };

export default async function FloorPage() {
  const user = await requireUser();
  const initial = await listOpenWorkOrders(user, { limit: 200 });
  return (
    <>
      <PageHeader title="Floor" kicker={`${initial.workOrders.length} units in the shop`} />
      <FloorBoard initial={initial} userId={user.id} isTech={user.role === "tech"} />
    </>
  );
}
