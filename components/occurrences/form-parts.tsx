"use client";

import type { ComponentProps, ReactNode } from "react";
import { inputClass } from "@/components/forms/field";

/** A row of big tap targets; the chosen one is pressed (and marked with a tick, not colour alone). */
export function Chips<T extends string>({
  options,
  value,
  onChange,
  label,
  columns = 2,
  allowClear = false,
}: {
  options: readonly { value: T; label: string }[];
  value: T | "";
  onChange: (value: T | "") => void;
  label: string;
  columns?: 2 | 3 | 4;
  allowClear?: boolean;
}) {
  const grid = { 2: "grid-cols-2", 3: "grid-cols-3", 4: "grid-cols-2 sm:grid-cols-4" }[columns];
  return (
    <div role="group" aria-label={label} className={`grid gap-2 ${grid}`}>
      {options.map((o) => {
        const on = value === o.value;
        return (
          <button
            key={o.value}
            type="button"
            aria-pressed={on}
            onClick={() => onChange(on && allowClear ? "" : o.value)}
            className={`flex min-h-12 items-center gap-1 rounded-card border-2 px-2 py-2 text-left leading-tight font-semibold ${
              on ? "border-ink bg-ink text-paper" : "border-rule-strong bg-white text-ink"
            }`}
          >
            <span aria-hidden className="w-4 shrink-0 text-center">
              {on ? "✓" : ""}
            </span>
            <span>{o.label}</span>
          </button>
        );
      })}
    </div>
  );
}

/** A question with its answer control and its error, read together by screen readers. */
export function Question({ id, label, hint, error, children }: { id: string; label: string; hint?: ReactNode; error?: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-1 text-base font-bold">{label}</legend>
      {children}
      {hint && !error ? <p className="text-sm text-ink-faint">{hint}</p> : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-rust-deep" data-testid={`error-${id}`}>
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

/** A number typed as text: phone keypads, a unit beside it, the value kept exactly as typed. */
export function TypedNumber({ unit, error, className = "", ...props }: ComponentProps<"input"> & { unit?: string; error?: string }) {
  return (
    <span className={`flex items-center gap-2 ${className}`}>
      <input type="text" inputMode="decimal" autoComplete="off" aria-invalid={error ? true : undefined} className={`${inputClass} figures max-w-36 text-lg`} {...props} />
      {unit ? <span className="font-semibold">{unit}</span> : null}
    </span>
  );
}
