"use client";

import useSWR from "swr";
import { fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { useNow } from "@/components/data/use-now";
import { summarizePattern } from "@/lib/occurrences/pattern";
import { OccurrenceChart } from "./occurrence-chart";
import { OccurrenceList } from "./occurrence-list";
import { PatternSummaryView } from "./pattern-summary";
import { logUrl, type OccurrenceLog } from "./types";
import { UnitToggle } from "./unit-toggle";
import { useTemperatureUnit } from "./use-temperature-unit";

/**
 * The shop's live view of one concern's log: summary, chart, list. It asks
 * for changes every few seconds, so an entry a driver logs shows up here
 * without a reload.
 */
export function ConcernLogPanel({ unitId, concernId, initial }: { unitId: string; concernId: string; initial: OccurrenceLog }) {
  const { data, error } = useSWR<OccurrenceLog>(logUrl(unitId, concernId), fetchJson, {
    fallbackData: initial,
    refreshInterval: LIVE_REFRESH_MS,
  });
  const [unit, setUnit] = useTemperatureUnit();
  const now = useNow(60_000);
  const entries = data?.occurrences ?? [];
  const summary = summarizePattern(entries, { now, unit });
  return (
    <div className="flex flex-col gap-4" data-testid="concern-log-panel" data-concern-id={concernId}>
      <PatternSummaryView summary={summary} />
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-bold">Occurrences against soak time and temperature</h3>
        <UnitToggle unit={unit} onChange={setUnit} />
      </div>
      {entries.length ? <OccurrenceChart entries={entries} unit={unit} summary={summary} /> : null}
      {error ? (
        <p role="status" className="text-sm text-rust-deep">
          Could not refresh the log just now; showing what was last loaded.
        </p>
      ) : null}
      <details open={entries.length <= 8}>
        <summary className="min-h-touch cursor-pointer py-2 font-bold">The log ({entries.length})</summary>
        <OccurrenceList entries={entries} unit={unit} />
      </details>
    </div>
  );
}
