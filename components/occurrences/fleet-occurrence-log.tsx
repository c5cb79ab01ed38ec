"use client";

import useSWR from "swr";
import { fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { Card, CardTitle } from "@/components/ui/card";
import { formatDate } from "@/lib/format";
import { OccurrenceForm } from "./occurrence-form";
import { OccurrenceList } from "./occurrence-list";
import { logUrl, type OccurrenceLog } from "./types";
import { useTemperatureUnit } from "./use-temperature-unit";

/** The fleet's page for one unit's log: the form first, then what the shop concluded, then the log. */
export function FleetOccurrenceLog({
  unitId,
  initial,
  meId,
  page,
  pager,
}: {
  unitId: string;
  initial: OccurrenceLog;
  meId: string;
  /** Which page of the log this is (the API's page size and cursor). */
  page: { limit: number; cursor?: string };
  /** Links to the other pages, rendered by the server. */
  pager?: React.ReactNode;
}) {
  const { data, mutate } = useSWR<OccurrenceLog>(logUrl(unitId, null, page), fetchJson, { fallbackData: initial, refreshInterval: LIVE_REFRESH_MS * 4 });
  const [unit] = useTemperatureUnit();
  const log = data ?? initial;
  const open = log.concerns.filter((c) => !c.closedAt);
  const closed = log.concerns.filter((c) => c.closedAt);
  const conclusions = closed.map((c) => (
    <Card key={c.id} data-testid="fleet-conclusion">
      <CardTitle>The shop found the cause</CardTitle>
      <p className="text-sm text-ink-faint">
        {c.complaint} · closed {formatDate(c.closedAt)}
      </p>
      <p className="mt-1">{c.conclusion}</p>
    </Card>
  ));
  return (
    <div className="flex flex-col gap-4">
      {open.length === 0 ? conclusions : null}
      <Card>
        <CardTitle>Log an occurrence</CardTitle>
        {open.length === 0 ? (
          <p className="mb-3 text-sm text-ink-soft">
            The shop has no open intermittent concern on this unit. You can still record what happened; the shop is told either way.
          </p>
        ) : open.length === 1 ? (
          <p className="mb-3 font-semibold">{open[0]!.complaint}</p>
        ) : null}
        <OccurrenceForm unitId={unitId} concerns={open.map((c) => ({ id: c.id, complaint: c.complaint, recordHint: c.recordHint }))} onLogged={() => void mutate()} />
      </Card>
      {open.length > 0 ? conclusions : null}
      <Card>
        <CardTitle id="log-title">Your log, newest first</CardTitle>
        <OccurrenceList entries={log.occurrences} unit={unit} meId={meId} empty="Nothing logged on this unit yet." />
        {pager}
      </Card>
    </div>
  );
}
