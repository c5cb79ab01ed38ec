"use client";

import { useState } from "react";
import { Field, inputClass } from "@/components/forms/field";
import { NO_VIN_MESSAGE, vinLiveCheck } from "@/lib/vin";

/**
 * The VIN, checked as it is typed (49 CFR 565.15(c)), or an explicit
 * "no VIN, serial only" with the maker's serial. The server checks again.
 */
export function VinField({ vin, serialOnly, serial, errors }: { vin: string; serialOnly: boolean; serial: string; errors: Record<string, string> }) {
  const [value, setValue] = useState(vin);
  const [noVin, setNoVin] = useState(serialOnly);
  const live = vinLiveCheck(value);
  const serverError = errors.vin;
  const shown = serverError && live.state !== "ok" ? { state: "error" as const, message: serverError } : live;
  return (
    <div className="flex flex-col gap-3 md:col-span-2">
      <label className="flex min-h-touch items-center gap-2">
        <input type="checkbox" name="serialOnly" checked={noVin} onChange={(e) => setNoVin(e.target.checked)} className="size-5 accent-rust" />
        No VIN: this unit has only a serial number
      </label>
      {noVin ? (
        <>
          <p className="text-sm text-ink-soft">{NO_VIN_MESSAGE}</p>
          <Field label="Serial number" name="serial" defaultValue={serial} error={errors.serial} />
        </>
      ) : (
        <div className="flex flex-col gap-1">
          <label htmlFor="unit-vin" className="font-semibold">
            VIN
          </label>
          <input
            id="unit-vin"
            name="vin"
            value={value}
            onChange={(e) => setValue(e.target.value)}
            autoComplete="off"
            spellCheck={false}
            autoCapitalize="characters"
            maxLength={40}
            aria-invalid={shown.state === "error" ? true : undefined}
            aria-describedby="vin-check"
            className={`${inputClass} figures font-mono tracking-wider uppercase`}
          />
          <span
            id="vin-check"
            aria-live="polite"
            data-testid="vin-check"
            data-state={shown.state}
            className={`text-sm ${shown.state === "error" ? "font-semibold text-rust-deep" : shown.state === "ok" ? "font-semibold text-ink" : "text-ink-faint"}`}
          >
            {shown.state === "ok" ? "✓ " : shown.state === "error" ? "✗ " : ""}
            {shown.message}
          </span>
        </div>
      )}
    </div>
  );
}
