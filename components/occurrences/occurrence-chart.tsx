"use client";

import {
  CartesianGrid,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  ScatterChart,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatDateTime } from "@/lib/format";
import type { PatternSummary } from "@/lib/occurrences/pattern";
import { symptomLabel } from "@/lib/occurrences/symptoms";
import { formatDegrees, inUnit, type TemperatureUnit } from "@/lib/occurrences/temperature";
import type { OccurrenceEntry } from "./types";

interface Point {
  id: string;
  hours: number;
  temp: number;
  at: string;
  what: string;
}

const INK = "#2a2a28";
const RUST = "#b4501e";

/**
 * Each entry as a dot: hours parked across, outside temperature up. Filled
 * dots did not come right by themselves, hollow ones did, diamonds did not
 * say: shape and fill, never colour alone. The shaded corner is where the
 * summary's thresholds meet (long and cold, for a cold-soak no-start).
 */
export function OccurrenceChart({ entries, unit, summary }: { entries: OccurrenceEntry[]; unit: TemperatureUnit; summary: PatternSummary }) {
  const plotted: (Point & { recovered: boolean | null })[] = entries.flatMap((e) =>
    e.hoursParked === null || e.ambientC === null
      ? []
      : [{ id: e.id, hours: e.hoursParked, temp: Math.round(inUnit(e.ambientC, unit) * 10) / 10, at: e.occurredAt, what: symptomLabel(e.symptom, e.symptomText), recovered: e.recovered }],
  );
  const missing = entries.length - plotted.length;
  const temps = plotted.map((p) => p.temp);
  const step = unit === "F" ? 10 : 5;
  const yMin = Math.floor(Math.min(...temps, summary.temperature.threshold ?? Infinity, unit === "F" ? 0 : -20) / step) * step - step;
  const yMax = Math.ceil(Math.max(...temps, summary.temperature.threshold ?? -Infinity, unit === "F" ? 40 : 5) / step) * step;
  const yTicks = Array.from({ length: (yMax - yMin) / step + 1 }, (_, i) => yMin + i * step);
  const xMax = Math.max(24, Math.ceil(Math.max(...plotted.map((p) => p.hours), 0) / 12) * 12);
  const xTicks = Array.from({ length: xMax / 12 + 1 }, (_, i) => i * 12);
  const hThreshold = summary.parked.threshold;
  const tThreshold = summary.temperature.threshold;

  const series = [
    { name: "Did not come right by itself", data: plotted.filter((p) => p.recovered === false), fill: INK, shape: "circle" as const },
    { name: "Came right by itself", data: plotted.filter((p) => p.recovered === true), fill: "#fbf8f2", shape: "circle" as const },
    { name: "Not said", data: plotted.filter((p) => p.recovered === null), fill: "#fbf8f2", shape: "diamond" as const },
  ].filter((s) => s.data.length > 0);

  return (
    <figure data-testid="occurrence-chart" data-points={plotted.length}>
      <div role="img" aria-label={`Chart of ${plotted.length} occurrences by hours parked and outside temperature. ${summary.headline}`} className="h-72 w-full sm:h-80">
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 8, right: 12, bottom: 24, left: 0 }}>
            <CartesianGrid stroke="#d8cdb9" strokeDasharray="3 3" />
            {hThreshold !== null && tThreshold !== null ? (
              <ReferenceArea x1={hThreshold} x2={xMax} y1={yMin} y2={tThreshold} fill={RUST} fillOpacity={0.1} stroke="none" ifOverflow="hidden" />
            ) : null}
            {hThreshold !== null ? (
              <ReferenceLine x={hThreshold} stroke={RUST} strokeDasharray="6 4" label={{ value: `${hThreshold} h`, position: "insideTopLeft", fill: RUST, fontSize: 12 }} />
            ) : null}
            {tThreshold !== null ? (
              <ReferenceLine y={tThreshold} stroke={RUST} strokeDasharray="6 4" label={{ value: `${formatDegrees(tThreshold)} °${unit}`, position: "insideTopRight", fill: RUST, fontSize: 12 }} />
            ) : null}
            <XAxis
              type="number"
              dataKey="hours"
              name="Parked"
              unit=" h"
              domain={[0, xMax]}
              ticks={xTicks}
              tick={{ fill: INK, fontSize: 12 }}
              label={{ value: "Hours parked before it happened", position: "bottom", offset: 4, fill: INK, fontSize: 13 }}
            />
            <YAxis
              type="number"
              dataKey="temp"
              name="Outside"
              unit={`°${unit}`}
              domain={[yMin, yMax]}
              ticks={yTicks}
              width={56}
              tick={{ fill: INK, fontSize: 12 }}
            />
            <Tooltip content={({ active, payload }) => <PointTip active={active} payload={payload} unit={unit} />} cursor={{ strokeDasharray: "3 3" }} />
            {series.map((s) => (
              <Scatter key={s.name} name={s.name} data={s.data} fill={s.fill} stroke={INK} strokeWidth={2} shape={s.shape} isAnimationActive={false} />
            ))}
          </ScatterChart>
        </ResponsiveContainer>
      </div>
      <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Key">
        {series.map((s) => (
          <li key={s.name} className="flex items-center gap-1.5">
            <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden>
              {s.shape === "diamond" ? (
                <path d="M7 1 L13 7 L7 13 L1 7 Z" fill={s.fill} stroke={INK} strokeWidth="2" />
              ) : (
                <circle cx="7" cy="7" r="5.5" fill={s.fill} stroke={INK} strokeWidth="2" />
              )}
            </svg>
            {s.name} ({s.data.length})
          </li>
        ))}
      </ul>
      <figcaption className="mt-1 text-sm text-ink-faint">
        Each mark is one entry. The shaded corner is past both thresholds in the summary.
        {missing > 0 ? ` ${missing} ${missing === 1 ? "entry has" : "entries have"} no parked time or temperature and ${missing === 1 ? "is" : "are"} only in the list.` : ""}
      </figcaption>
    </figure>
  );
}

function PointTip({ active, payload, unit }: { active?: boolean; payload?: readonly { payload?: unknown }[]; unit: TemperatureUnit }) {
  const point = payload?.[0]?.payload as Point | undefined;
  if (!active || !point) return null;
  return (
    <div className="rounded-card border-2 border-ink bg-paper-card px-3 py-2 text-sm shadow">
      <p className="font-bold">{formatDateTime(point.at)}</p>
      <p>{point.what}</p>
      <p className="figures">
        {point.hours} h parked · {formatDegrees(point.temp)} °{unit}
      </p>
    </div>
  );
}
