import type { Metadata } from "next";
import { FleetUnits } from "@/components/fleet/fleet-units";
import { FleetWatchList } from "@/components/occurrences/fleet-watch-list";
import { PageHeader } from "@/components/ui/page-header";
import { getAccountName } from "@/db/queries/settings";
import { listUnits } from "@/db/queries/units";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { inputClass } from "@/components/forms/field";
import { Button, ButtonLink } from "@/components/ui/button";
import { requirePageRole } from "@/lib/server/auth/page-access";
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
      <PageHeader title="Your units" kicker={accountName}>
        <ButtonLink href="/fleet/reports/new">Report a defect</ButtonLink>
      </PageHeader>
      <form method="get" action="/fleet/units" role="search" className="mb-4 flex gap-2">
        <label className="sr-only" htmlFor="unit-search">
          Search your units
        </label>
        <input id="unit-search" name="q" type="search" placeholder="Find a unit: number, part of the VIN, plate" className={`${inputClass} flex-1`} />
        <Button type="submit" variant="secondary">
          Find
        </Button>
      </form>
      <FleetWatchList user={user} compact />
      <FleetUnits initialUnits={units} initialOrders={orders} />
    </>
  );
}
