import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { StatusPill } from "@/components/ui/status-pill";
import type { UnitListItem } from "@/db/queries/units";
import { workOrderLabel } from "@/lib/domain";

/**
 * A page of units as a list that reads on a phone and a desktop alike: the
 * number, what it is, where it stands, and (for the shop) the way in.
 */
export function UnitList({
  units,
  unitHref,
  visitHref,
  checkInHref,
  showAccount,
  empty,
}: {
  units: UnitListItem[];
  unitHref: (id: string) => string;
  visitHref: (workOrderId: string) => string;
  checkInHref?: (unitId: string) => string;
  showAccount: boolean;
  empty: React.ReactNode;
}) {
  if (units.length === 0) return <EmptyState title="No units here.">{empty}</EmptyState>;
  return (
    <ul className="divide-y divide-rule rounded-card border border-rule bg-paper-card" data-testid="unit-list">
      {units.map((u) => (
        <li key={u.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-3 py-2" data-testid="unit-row">
          <div className="min-w-0 flex-1">
            <p>
              <Link href={unitHref(u.id)} className="text-lg font-bold">
                {u.unitNumber}
              </Link>{" "}
              <span className="text-sm text-ink-soft">
                {u.year ? `${u.year} ` : ""}
                {u.description}
              </span>
            </p>
            <p className="figures text-sm break-all text-ink-faint">
              {showAccount ? `${u.accountName} · ` : ""}
              {u.vin ? `VIN ${u.vin}` : u.serialNumber ? `Serial ${u.serialNumber}` : "No VIN"}
              {u.plate ? ` · Plate ${u.plate}` : ""}
              {u.retired ? " · retired" : ""}
            </p>
          </div>
          <div className="flex flex-wrap items-center gap-2">
            {u.workOrderId && u.status !== "released" ? (
              <Link href={visitHref(u.workOrderId)} className="flex items-center gap-2 no-underline">
                <StatusPill status={u.status} size="sm" />
                {u.workOrderNumber ? <span className="figures text-sm">{workOrderLabel(u.workOrderNumber)}</span> : null}
              </Link>
            ) : (
              <span className="text-sm text-ink-faint">Not in the shop</span>
            )}
            {checkInHref && !u.retired && !(u.workOrderId && u.status !== "released") ? (
              <Link href={checkInHref(u.id)} className={buttonClass("secondary", "no-underline")}>
                Check in
              </Link>
            ) : null}
          </div>
        </li>
      ))}
    </ul>
  );
}
