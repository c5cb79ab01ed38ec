import { PhotoStrip } from "@/components/findings/photo-strip";
import { formatDateTime } from "@/lib/format";
import { symptomLabel } from "@/lib/occurrences/symptoms";
import { formatTemperature, type TemperatureUnit } from "@/lib/occurrences/temperature";
import { formatNumber } from "@/lib/specs/exact";
import type { OccurrenceEntry } from "./types";

const RECOVERED: Record<string, string> = { true: "Came right by itself", false: "Did not come right", null: "" };

/** The log, newest first: one compact card per entry, the facts in tabular figures. */
export function OccurrenceList({
  entries,
  unit,
  meId,
  empty = "Nothing logged yet.",
}: {
  entries: OccurrenceEntry[];
  unit: TemperatureUnit;
  meId?: string;
  empty?: string;
}) {
  if (!entries.length) return <p className="text-ink-faint">{empty}</p>;
  return (
    <ol className="flex flex-col divide-y divide-rule" data-testid="occurrence-list">
      {entries.map((e) => (
        <li key={e.id} className="flex items-start gap-3 py-2" data-testid="occurrence-row" data-id={e.id}>
          <div className="min-w-0 flex-1">
            <div className="flex flex-wrap items-baseline justify-between gap-x-3">
              <p className="font-bold">{symptomLabel(e.symptom, e.symptomText)}</p>
              <time className="figures text-sm text-ink-faint" dateTime={e.occurredAt}>
                {formatDateTime(e.occurredAt)}
              </time>
            </div>
            <p className="figures flex flex-wrap gap-x-3 text-sm">
              <span>
                <span className="text-ink-faint">Parked</span> {e.hoursParked === null ? "—" : `${formatNumber(e.hoursParked, 1)} h`}
              </span>
              <span>
                <span className="text-ink-faint">Outside</span> {e.ambientC === null ? "—" : formatTemperature(e.ambientC, unit)}
              </span>
              <span>
                <span className="text-ink-faint">Battery</span> {e.batteryVolts === null ? "—" : `${formatNumber(e.batteryVolts, 2)} V`}
              </span>
              {e.recovered !== null ? <span>{RECOVERED[String(e.recovered)]}</span> : null}
            </p>
            {e.note ? <p className="mt-0.5 text-sm">“{e.note}”</p> : null}
            <p className="text-xs text-ink-faint">
              {e.createdBy ? (meId && e.createdBy.id === meId ? "You" : e.createdBy.name) : "Someone"}
            </p>
          </div>
          {e.photo ? (
            <PhotoStrip
              size="sm"
              photos={[{ id: e.photo.id, name: "", url: e.photo.url, thumbUrl: e.photo.thumbUrl, width: null, height: null }]}
              // The date, not the symptom: the photo's button must not answer to the form's symptom names.
              title={`Entry of ${formatDateTime(e.occurredAt)}`}
            />
          ) : null}
        </li>
      ))}
    </ol>
  );
}
