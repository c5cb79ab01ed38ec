import type { Metadata } from "next";
import Link from "next/link";
import { SelectField, inputClass } from "@/components/forms/field";
import { Button, ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Pager } from "@/components/ui/pager";
import { UnitList } from "@/components/units/unit-list";
import { accountChoices } from "@/db/queries/accounts";
import { listUnits } from "@/db/queries/units";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { decodeCursor } from "@/lib/http/pagination";
import { CAN, hasRole } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Units" };

const PAGE = 50;

export default async function ShopUnitsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.shopStaff);
  const p = await searchParams;
  const params = { q: p.q?.slice(0, 100), accountId: p.accountId, inShop: p.inShop === "true" ? "true" : undefined, retired: p.retired === "true" ? "true" : undefined, cursor: decodeCursor(p.cursor, 2) ? p.cursor : undefined, page: p.page };
  const [accounts, result] = await Promise.all([
    accountChoices(),
    listUnits(user, { limit: PAGE, q: params.q, accountId: params.accountId, inShop: Boolean(params.inShop), retired: Boolean(params.retired), cursor: params.cursor }),
  ]);
  const canEdit = hasRole(user, CAN.manageAccounts);
  return (
    <>
      <PageHeader title="Units" kicker="Every fleet's units">
        {canEdit ? <ButtonLink href={params.accountId ? `/units/new?accountId=${params.accountId}` : "/units/new"}>Add a unit</ButtonLink> : null}
      </PageHeader>
      <form method="get" action="/units" role="search" className="mb-4 grid gap-3 rounded-card border border-rule bg-paper-card p-3 md:grid-cols-[2fr_1fr_auto_auto_auto] md:items-end">
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Search</span>
          <input name="q" type="search" defaultValue={params.q} placeholder="Unit number, 4+ characters of a VIN, plate, description, account" className={inputClass} />
        </label>
        <SelectField label="Account" name="accountId" defaultValue={params.accountId ?? ""} options={[["", "All accounts"], ...accounts.map((a) => [a.id, a.name] as const)]} />
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" name="inShop" value="true" defaultChecked={Boolean(params.inShop)} className="size-5 accent-rust" />
          In the shop
        </label>
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" name="retired" value="true" defaultChecked={Boolean(params.retired)} className="size-5 accent-rust" />
          Retired
        </label>
        <Button type="submit">Find</Button>
      </form>
      <UnitList
        units={result.units}
        showAccount
        unitHref={(id) => `/units/${id}`}
        visitHref={(woId) => `/work-orders/${woId}`}
        checkInHref={canEdit ? (id) => `/work-orders/new?unitId=${id}` : undefined}
        empty={
          accounts.length === 0 ? (
            <Link href="/accounts/new">Create a fleet account first, then add its units.</Link>
          ) : params.q ? (
            "Nothing matches that search."
          ) : canEdit ? (
            <Link href="/units/new">Add the first unit</Link>
          ) : null
        }
      />
      <Pager base="/units" params={params} nextCursor={result.nextCursor} />
    </>
  );
}
