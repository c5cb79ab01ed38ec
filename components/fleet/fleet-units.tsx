"use client";

import Link from "next/link";
import useSWR from "swr";
import { fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { useNow } from "@/components/data/use-now";
import { SeverityMark } from "@/components/findings/severity-mark";
import { StatusPill } from "@/components/ui/status-pill";
import type { WorkOrderListItem } from "@/db/queries/work-order-list";
import { workOrderLabel, type WorkOrderStatus } from "@/lib/domain";
import { formatAgo, formatDateTime } from "@/lib/format";

export interface FleetUnit {
  id: string;
  unitNumber: string;
  description: string;
  status: WorkOrderStatus | null;
  workOrderId: string | null;
  updatedAt: string;
}

type Units = { units: FleetUnit[]; nextCursor: string | null };
type Orders = { workOrders: WorkOrderListItem[]; nextCursor: string | null };

export const FLEET_UNITS_KEY = "/api/v1/units?limit=200";
export const FLEET_ORDERS_KEY = "/api/v1/work-orders?limit=200";

/** The account's units, those in the shop first, with live status and the shop's latest note. */
export function FleetUnits({ initialUnits, initialOrders }: { initialUnits: Units; initialOrders: Orders }) {
  const units = useSWR<Units>(FLEET_UNITS_KEY, fetchJson, { fallbackData: initialUnits, refreshInterval: LIVE_REFRESH_MS });
  const orders = useSWR<Orders>(FLEET_ORDERS_KEY, fetchJson, { fallbackData: initialOrders, refreshInterval: LIVE_REFRESH_MS });
  const byId = new Map((orders.data?.workOrders ?? []).map((w) => [w.id, w]));
  const all = units.data?.units ?? [];
  // Out of service first: the fleet must see those before anything else.
  const oos = (u: FleetUnit) => (u.workOrderId ? byId.get(u.workOrderId)?.outOfService === true : false);
  const inShop = all.filter((u) => u.workOrderId && u.status !== "released").sort((a, b) => Number(oos(b)) - Number(oos(a)));
  const home = all.filter((u) => !(u.workOrderId && u.status !== "released"));
  const now = new Date(useNow());

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="in-shop">
        <h2 id="in-shop" className="mb-2 text-xl font-bold">
          In the shop <span className="figures text-ink-faint">({inShop.length})</span>
        </h2>
        {inShop.length === 0 ? <p className="text-ink-faint">None of your units are in the shop.</p> : null}
        <ul className="grid gap-3 md:grid-cols-2">
          {inShop.map((u) => {
            const wo = u.workOrderId ? byId.get(u.workOrderId) : undefined;
            return (
              <li key={u.id} data-testid="fleet-unit-in-shop">
                <Link
                  href={u.status === "waiting_approval" && u.workOrderId ? `/fleet/work-orders/${u.workOrderId}` : `/fleet/units/${u.id}`}
                  className="block rounded-card border-2 border-ink bg-paper-card p-4 no-underline hover:bg-paper-deep"
                >
                  <div className="flex flex-wrap items-baseline justify-between gap-2">
                    <span className="text-xl font-bold">{u.unitNumber}</span>
                    {wo ? <span className="figures text-sm text-ink-faint">{workOrderLabel(wo.number)}</span> : null}
                  </div>
                  <p className="text-sm text-ink-soft">{u.description}</p>
                  <div className="mt-2 flex flex-wrap items-center gap-3">
                    <StatusPill status={u.status} />
                    {wo?.outOfService ? <SeverityMark severity="out_of_service" /> : null}
                  </div>
                  {wo?.title ? <p className="mt-2 font-semibold">{wo.title}</p> : null}
                  {wo?.lastNote ? <p className="mt-1 text-sm">“{wo.lastNote}”</p> : null}
                  {u.status === "waiting_approval" && wo ? (
                    <p className="mt-2 font-bold text-rust-deep underline underline-offset-4">Review the estimate ›</p>
                  ) : null}
                  <p className="mt-2 text-xs text-ink-faint">
                    Updated {formatAgo(u.updatedAt, now)}
                    {wo?.promisedAt ? ` · promised ${formatDateTime(wo.promisedAt)}` : ""}
                  </p>
                </Link>
              </li>
            );
          })}
        </ul>
      </section>
      <section aria-labelledby="at-home">
        <h2 id="at-home" className="mb-2 text-xl font-bold">
          Not in the shop <span className="figures text-ink-faint">({home.length})</span>
        </h2>
        <ul className="divide-y divide-rule rounded-card border border-rule bg-paper-card">
          {home.map((u) => (
            <li key={u.id} data-testid="fleet-unit">
              <Link href={`/fleet/units/${u.id}`} className="flex min-h-touch items-center justify-between gap-3 px-4 py-2 no-underline hover:bg-paper-deep">
                <span>
                  <span className="font-bold">{u.unitNumber}</span>{" "}
                  <span className="text-sm text-ink-soft">{u.description}</span>
                </span>
                <span aria-hidden className="text-ink-faint">›</span>
              </Link>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
