"use client";

import Link from "next/link";
import { LiveRefresh } from "@/components/data/live-refresh";
import { useNow } from "@/components/data/use-now";
import { EmptyState } from "@/components/ui/empty-state";
import { StatusPill } from "@/components/ui/status-pill";
import type { FloorCard, FloorData } from "@/db/queries/work-order-list";
import { STATUS_LABELS } from "@/lib/domain";
import { WorkOrderCard } from "./work-order-card";

/**
 * Every unit in the building, grouped by where its visit stands. Each lane shows its newest
 * page (the API's page size) and links to the full, paged list of that status. The data comes
 * once, as this component's props (only what a card shows); the server sends it again on each
 * refresh (LiveRefresh), so there is no second copy in a client cache.
 */
export function FloorBoard({ floor, userId, isTech, renderedAt }: { floor: FloorData; userId: string; isTech: boolean; renderedAt: number }) {
  const now = useNow(30_000, renderedAt);
  const href = (w: FloorCard) => `/work-orders/${w.id}`;
  const mine = floor.mine?.workOrders ?? [];

  return (
    <div className="flex flex-col gap-6">
      <LiveRefresh />
      {isTech ? (
        <section aria-labelledby="mine">
          <h2 id="mine" className="mb-2 text-xl font-bold">
            Assigned to you <span className="figures text-ink-faint">({mine.length}{floor.mine?.more ? "+" : ""})</span>
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
          {floor.mine?.more ? (
            <p className="mt-2">
              <Link href={`/work-orders?${new URLSearchParams({ open: "true", technicianId: userId })}`}>All your open work orders</Link>
            </p>
          ) : null}
        </section>
      ) : null}
      {isTech ? <h2 className="-mb-3 text-xl font-bold">Everything on the Floor</h2> : null}
      {floor.lanes.map(({ status, workOrders: group, total }) => {
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
                {total} unit{total === 1 ? "" : "s"}
              </span>
            </div>
            {group.length ? (
              <div className="flex flex-col gap-3">
                <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
                  {group.map((w) => (
                    <WorkOrderCard key={w.id} wo={w} now={now} href={href(w)} />
                  ))}
                </div>
                {total > group.length ? (
                  <p className="text-sm">
                    Showing the newest {group.length} of {total}.{" "}
                    <Link href={`/work-orders?${new URLSearchParams({ status })}`} data-testid={`floor-more-${status}`}>
                      All {total} in {STATUS_LABELS[status]}
                    </Link>
                  </p>
                ) : null}
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
