"use client";

import useSWR from "swr";
import { fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { StatusPill } from "@/components/ui/status-pill";
import type { WorkOrderStatus } from "@/lib/domain";

type UnitStatus = { status: WorkOrderStatus | null; workOrderId: string | null };

/** The unit's status, kept fresh without a reload. */
export function LiveUnitStatus({ unitId, initial }: { unitId: string; initial: UnitStatus }) {
  const { data } = useSWR<UnitStatus>(`/api/v1/units/${unitId}`, fetchJson, {
    fallbackData: initial,
    refreshInterval: LIVE_REFRESH_MS,
  });
  const inShop = data?.workOrderId && data.status !== "released";
  return (
    <div data-testid="live-unit-status" aria-live="polite">
      <StatusPill status={inShop ? (data?.status ?? null) : null} />
    </div>
  );
}
