"use client";

import type { TemperatureUnit } from "@/lib/occurrences/temperature";

/** Two big buttons, °F and °C; the chosen one is pressed. */
export function UnitToggle({ unit, onChange, label = "Temperature unit" }: { unit: TemperatureUnit; onChange: (u: TemperatureUnit) => void; label?: string }) {
  return (
    <div role="group" aria-label={label} className="inline-flex overflow-hidden rounded-card border-2 border-ink">
      {(["F", "C"] as const).map((u) => (
        <button
          key={u}
          type="button"
          aria-pressed={unit === u}
          onClick={() => onChange(u)}
          className={`min-h-touch min-w-touch px-3 font-bold ${unit === u ? "bg-ink text-paper" : "bg-paper-card text-ink"}`}
        >
          °{u}
        </button>
      ))}
    </div>
  );
}
