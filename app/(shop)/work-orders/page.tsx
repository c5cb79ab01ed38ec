import type { Metadata } from "next";
import Link from "next/link";
import { SelectField, inputClass } from "@/components/forms/field";
import { Button, ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { StatusPill } from "@/components/ui/status-pill";
import { Pager } from "@/components/ui/pager";
import { accountChoices } from "@/db/queries/accounts";
import { assignableStaff } from "@/db/queries/people";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { isCalendarDate } from "@/lib/dates";
import { STATUS_LABELS, WORK_ORDER_STATUSES, type WorkOrderStatus } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { decodeCursor } from "@/lib/http/pagination";

export const metadata: Metadata = { title: "Work orders" };

/** Every visit, open or past, with filters: status, account, technician, the dates it was opened. */
export default async function WorkOrdersPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.shopStaff);
  const p = await searchParams;
  const status = (WORK_ORDER_STATUSES as readonly string[]).includes(p.status ?? "") ? (p.status as WorkOrderStatus) : undefined;
  const date = (v: string | undefined) => (v && isCalendarDate(v) ? v : undefined);
  const params = {
    status,
    open: p.open === "true" ? "true" : undefined,
    accountId: p.accountId || undefined,
    technicianId: p.technicianId || undefined,
    openedFrom: date(p.openedFrom),
    openedTo: date(p.openedTo),
    cursor: decodeCursor(p.cursor, 1) ? p.cursor : undefined,
    page: p.page,
  };
  const [accounts, staff, result] = await Promise.all([
    accountChoices(),
    assignableStaff(),
    listOpenWorkOrders(user, { limit: 50, ...params, all: !params.open }),
  ]);
  return (
    <>
      <PageHeader title="Work orders" kicker="Open and past visits">
        {hasRole(user, CAN.manageAccounts) ? <ButtonLink href="/work-orders/new">Check a unit in</ButtonLink> : null}
      </PageHeader>
      <form method="get" action="/work-orders" className="mb-4 grid gap-3 rounded-card border border-rule bg-paper-card p-3 sm:grid-cols-2 lg:grid-cols-6 lg:items-end">
        <SelectField label="Status" name="status" defaultValue={status ?? ""} options={[["", "Any"], ...WORK_ORDER_STATUSES.map((s) => [s, STATUS_LABELS[s]] as const)]} />
        <SelectField label="Account" name="accountId" defaultValue={params.accountId ?? ""} options={[["", "All"], ...accounts.map((a) => [a.id, a.name] as const)]} />
        <SelectField label="Technician" name="technicianId" defaultValue={params.technicianId ?? ""} options={[["", "Anyone"], ...staff.map((s) => [s.id, s.name] as const)]} />
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Opened from</span>
          <input type="date" name="openedFrom" defaultValue={params.openedFrom} className={inputClass} />
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold">to</span>
          <input type="date" name="openedTo" defaultValue={params.openedTo} className={inputClass} />
        </label>
        <div className="flex flex-col gap-2">
          <label className="flex items-center gap-2">
            <input type="checkbox" name="open" value="true" defaultChecked={Boolean(params.open)} className="size-5 accent-rust" />
            Open only
          </label>
          <Button type="submit">Filter</Button>
        </div>
      </form>
      {result.workOrders.length === 0 ? (
        <EmptyState title="No work orders match.">
          <Link href="/work-orders">Clear the filters</Link>
        </EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-card border border-rule bg-paper-card">
          <table className="w-full text-sm" data-testid="work-order-list">
            <thead>
              <tr className="border-b-2 border-ink text-left">
                <th className="px-3 py-2">Work order</th>
                <th className="px-3 py-2">Unit</th>
                <th className="px-3 py-2">Account</th>
                <th className="px-3 py-2">Status</th>
                <th className="px-3 py-2">Technician</th>
                <th className="px-3 py-2">Opened</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-rule">
              {result.workOrders.map((w) => (
                <tr key={w.id} className="align-top">
                  <td className="px-3 py-2">
                    <Link href={`/work-orders/${w.id}`} className="figures font-bold">
                      {w.label}
                    </Link>
                    <span className="block text-ink-soft">{w.title}</span>
                  </td>
                  <td className="px-3 py-2 font-semibold whitespace-nowrap">{w.unitNumber}</td>
                  <td className="px-3 py-2">{w.accountName}</td>
                  <td className="px-3 py-2">
                    <StatusPill status={w.status} size="sm" />
                  </td>
                  <td className="px-3 py-2">{w.technicianName ?? "Not assigned"}</td>
                  <td className="figures px-3 py-2 whitespace-nowrap">
                    {formatDate(w.openedAt)}
                    {w.releasedAt ? ` – ${formatDate(w.releasedAt)}` : ""}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <Pager base="/work-orders" params={params} nextCursor={result.nextCursor} />
    </>
  );
}
