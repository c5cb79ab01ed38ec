import type { Metadata } from "next";
import { FleetUnits } from "@/components/fleet/fleet-units";
import { FleetWatchList } from "@/components/occurrences/fleet-watch-list";
import { PageHeader } from "@/components/ui/page-header";
import { getAccountName } from "@/db/queries/settings";
import { listUnits } from "@/db/queries/units";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { requirePageRole } from "@/lib/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Your units" };

export default async function FleetHome() {
  const user = await requirePageRole(CAN.fleet);
  const [units, orders, accountName] = await Promise.all([
    listUnits(user, { limit: 200 }),
    listOpenWorkOrders(user, { limit: 200 }),
    getAccountName(user.accountId ?? ""),
  ]);
  return (
    <>
      <PageHeader title="Your units" kicker={accountName} />
      <FleetWatchList user={user} compact />
      <FleetUnits initialUnits={units} initialOrders={orders} />
    </>
  );
}
