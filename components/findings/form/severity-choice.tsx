"use client";

import { SEVERITIES, SEVERITY_LABELS, type Severity } from "@/lib/domain";
import { SeverityShape } from "../severity-mark";

const HINTS: Record<Severity, string> = {
  out_of_service: "Unsafe to drive or operate",
  fix_now: "Fix on this visit",
  plan: "Plan for a later visit",
  note: "For the record",
};

/** Four big choices, each a word and its shape, one thumb apart. */
export function SeverityChoice({ value, onChange }: { value: Severity | null; onChange: (s: Severity) => void }) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold">How serious is it?</legend>
      <div className="grid grid-cols-2 gap-2">
        {SEVERITIES.map((s) => (
          <label
            key={s}
            className={`flex min-h-16 cursor-pointer items-center gap-2 rounded-card border-2 px-3 py-2 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-rust ${
              value === s ? "border-ink bg-paper-deep" : "border-rule-strong bg-white"
            }`}
          >
            <input type="radio" name="severity" value={s} checked={value === s} onChange={() => onChange(s)} className="sr-only" />
            <SeverityShape severity={s} size={26} />
            <span className="flex flex-col leading-tight">
              <span className="font-bold">{SEVERITY_LABELS[s]}</span>
              <span className="text-xs text-ink-faint">{HINTS[s]}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
