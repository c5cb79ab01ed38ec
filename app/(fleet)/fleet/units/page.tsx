import type { Metadata } from "next";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Pager } from "@/components/ui/pager";
import { UnitList } from "@/components/units/unit-list";
import { getAccountName } from "@/db/queries/settings";
import { listUnits } from "@/db/queries/units";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { decodeCursor } from "@/lib/http/pagination";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Find a unit" };

/** The fleet's own units, searched the same way as the shop's, paged. */
export default async function FleetUnitsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.fleet);
  const p = await searchParams;
  const params = { q: p.q?.slice(0, 100), inShop: p.inShop === "true" ? "true" : undefined, cursor: decodeCursor(p.cursor, 2) ? p.cursor : undefined, page: p.page };
  const [accountName, result] = await Promise.all([
    getAccountName(user.accountId ?? ""),
    listUnits(user, { limit: 50, q: params.q, inShop: Boolean(params.inShop), cursor: params.cursor }),
  ]);
  return (
    <>
      <PageHeader title="Find a unit" kicker={accountName} />
      <form method="get" action="/fleet/units" role="search" className="mb-4 flex flex-col gap-3 rounded-card border border-rule bg-paper-card p-3 sm:flex-row sm:items-end">
        <label className="flex flex-1 flex-col gap-1">
          <span className="font-semibold">Search your units</span>
          <input name="q" type="search" defaultValue={params.q} placeholder="Number, part of the VIN, plate, description" className={inputClass} />
        </label>
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" name="inShop" value="true" defaultChecked={Boolean(params.inShop)} className="size-5 accent-rust" />
          In the shop
        </label>
        <Button type="submit">Find</Button>
      </form>
      <UnitList
        units={result.units}
        showAccount={false}
        unitHref={(id) => `/fleet/units/${id}`}
        visitHref={(woId) => `/fleet/work-orders/${woId}`}
        empty={params.q ? "Nothing matches that search." : "The shop has not added your units yet."}
      />
      <Pager base="/fleet/units" params={params} nextCursor={result.nextCursor} />
    </>
  );
}
