"use client";

import useSWR from "swr";
import { fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { FindingList } from "@/components/findings/finding-list";
import { Card, CardTitle } from "@/components/ui/card";
import { StatusPill } from "@/components/ui/status-pill";
import { Timeline } from "@/components/work-order/timeline";
import type { CurrentVisit } from "@/db/queries/finding-reads";
import { formatDateTime } from "@/lib/format";

export const visitKey = (unitId: string) => `/api/v1/units/${unitId}/visit`;

// One request feeds the header pill and the visit panel: SWR shares the key.
function useVisit(unitId: string, initial: CurrentVisit) {
  return useSWR<CurrentVisit>(visitKey(unitId), fetchJson, { fallbackData: initial, refreshInterval: LIVE_REFRESH_MS });
}

export function LiveVisitStatus({ unitId, initial }: { unitId: string; initial: CurrentVisit }) {
  const { data } = useVisit(unitId, initial);
  return (
    <div data-testid="live-unit-status" aria-live="polite">
      <StatusPill status={data?.workOrder?.status ?? null} />
    </div>
  );
}

/** The visit in progress as the fleet sees it, kept fresh without a reload: status, the shop's note, findings, timeline. */
export function LiveVisit({ unitId, initial }: { unitId: string; initial: CurrentVisit }) {
  const { data, error } = useVisit(unitId, initial);
  const wo = data?.workOrder ?? null;
  if (!wo) {
    return (
      <Card>
        <CardTitle>This visit</CardTitle>
        <p className="text-ink-faint">This unit is not in the shop.</p>
      </Card>
    );
  }
  return (
    <>
      <Card aria-labelledby="visit-title" data-testid="live-visit">
        <CardTitle id="visit-title">
          This visit · <span className="figures">{wo.label}</span>
        </CardTitle>
        {wo.title ? <p className="font-semibold">{wo.title}</p> : null}
        <div className="mt-2 flex flex-wrap items-center gap-3" aria-live="polite">
          <StatusPill status={wo.status} />
          {wo.promisedAt ? <span className="text-sm text-ink-soft">Promised {formatDateTime(wo.promisedAt)}</span> : null}
        </div>
        {wo.lastNote ? (
          <blockquote className="mt-3 border-l-4 border-rust pl-3" data-testid="latest-note">
            <p>“{wo.lastNote}”</p>
            {wo.lastNoteAt ? <footer className="text-xs text-ink-faint">The shop, {formatDateTime(wo.lastNoteAt)}</footer> : null}
          </blockquote>
        ) : null}
        {error ? <p className="mt-2 text-sm text-ink-faint">Lost touch with the shop for a moment; retrying…</p> : null}
      </Card>
      <Card aria-labelledby="found-title">
        <CardTitle id="found-title">What the shop found</CardTitle>
        <FindingList findings={data?.findings ?? []} empty="Nothing posted yet." />
      </Card>
      <Card>
        <CardTitle>Updates</CardTitle>
        <Timeline entries={data?.timeline ?? []} />
      </Card>
    </>
  );
}
