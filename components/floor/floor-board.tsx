"use client";

import useSWR from "swr";
import { fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { useNow } from "@/components/data/use-now";
import { EmptyState } from "@/components/ui/empty-state";
import { StatusPill } from "@/components/ui/status-pill";
import type { WorkOrderListItem } from "@/db/queries/work-order-list";
import { OPEN_STATUSES } from "@/lib/domain";
import { WorkOrderCard } from "./work-order-card";

type ListResponse = { workOrders: WorkOrderListItem[]; nextCursor: string | null };

export const FLOOR_KEY = "/api/v1/work-orders?limit=200";

/** Every unit in the building, grouped by where its visit stands; refreshes itself. */
export function FloorBoard({ initial, userId, isTech }: { initial: ListResponse; userId: string; isTech: boolean }) {
  const { data, error } = useSWR<ListResponse>(FLOOR_KEY, fetchJson, {
    fallbackData: initial,
    refreshInterval: LIVE_REFRESH_MS,
    revalidateOnFocus: true,
  });
  const workOrders = data?.workOrders ?? [];
  const now = useNow();
  const mine = isTech ? workOrders.filter((w) => w.technicianId === userId) : [];
  const href = (w: WorkOrderListItem) => `/work-orders/${w.id}`;

  return (
    <div className="flex flex-col gap-6">
      {error ? (
        <p role="status" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm">
          Lost touch with the server; showing what we had. Retrying…
        </p>
      ) : null}
      {isTech ? (
        <section aria-labelledby="mine">
          <h2 id="mine" className="mb-2 text-xl font-bold">
            Assigned to you <span className="figures text-ink-faint">({mine.length})</span>
          </h2>
          {mine.length ? (
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              {mine.map((w) => (
                <div key={w.id}>
                  <div className="mb-1">
                    <StatusPill status={w.status} size="sm" />
                  </div>
                  <WorkOrderCard wo={w} now={now} href={href(w)} />
                </div>
              ))}
            </div>
          ) : (
            <EmptyState title="Nothing assigned to you right now." />
          )}
        </section>
      ) : null}
      {isTech ? <h2 className="-mb-3 text-xl font-bold">Everything on the Floor</h2> : null}
      {OPEN_STATUSES.map((status) => {
        const group = workOrders.filter((w) => w.status === status);
        // Swimlanes on a desktop (status on the left, units flowing right); stacked on a phone.
        return (
          <section
            key={status}
            aria-label={status}
            data-testid={`floor-lane-${status}`}
            className="border-t border-rule pt-3 lg:grid lg:grid-cols-[12rem_1fr] lg:gap-4"
          >
            <div className="mb-2 flex items-center gap-3 lg:flex-col lg:items-start">
              <StatusPill status={status} />
              <span className="figures text-sm text-ink-faint">
                {group.length} unit{group.length === 1 ? "" : "s"}
              </span>
            </div>
            {group.length ? (
              <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
                {group.map((w) => (
                  <WorkOrderCard key={w.id} wo={w} now={now} href={href(w)} />
                ))}
              </div>
            ) : (
              <p className="text-sm text-ink-faint lg:self-center">None.</p>
            )}
          </section>
        );
      })}
    </div>
  );
}
