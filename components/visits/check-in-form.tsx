"use client";

import Link from "next/link";
import { useState } from "react";
import { Field, FormMessage, SelectField, inputClass } from "@/components/forms/field";
import { staffOptions } from "./staff-options";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { Money } from "@/components/ui/money";
import { checkInAction } from "@/lib/server/actions/visits";

export interface CheckInSetup {
  unitId: string;
  unitNumber: string;
  serviceRequestId: string | null;
  complaints: string[];
  staff: { id: string; name: string; role: string }[];
  lastOdometer: number | null;
  lastEngineHours: number | null;
  odometer: string;
  engineHours: string;
  poRequired: boolean;
  deferred: { id: string; description: string; amountCents: number; state: "held" | "declined"; woLabel: string }[];
}

/** Check-in: what the unit came in for, its meters, who works on it, when it is promised, and deferred work to bring back. */
export function CheckInForm({ setup }: { setup: CheckInSetup }) {
  const [state, action, pending, formRef] = useGuardedForm(checkInAction);
  const [complaints, setComplaints] = useState<string[]>(setup.complaints.length ? setup.complaints : [""]);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const inShop = state && !state.ok && state.code === "unit_in_shop" ? String(state.extra?.href ?? "") : null;
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-5" data-testid="check-in-form">
      <input type="hidden" name="unitId" value={setup.unitId} />
      {setup.serviceRequestId ? <input type="hidden" name="serviceRequestId" value={setup.serviceRequestId} /> : null}
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-lg font-bold">Complaints</legend>
        <p className="text-sm text-ink-soft">In the customer&apos;s words, one concern each. Cause and correction are written as the work goes.</p>
        {complaints.map((c, i) => (
          <label key={i} className="flex flex-col gap-1">
            <span className="text-sm font-semibold">Concern {i + 1}</span>
            <textarea
              name="complaint"
              value={c}
              rows={2}
              onChange={(e) => setComplaints(complaints.map((x, j) => (j === i ? e.target.value : x)))}
              className={`${inputClass} py-2`}
              aria-invalid={errors.concerns || errors[`concerns.${i}.complaint`] ? true : undefined}
            />
          </label>
        ))}
        {errors.concerns ? <p className="text-sm font-semibold text-rust-deep">{errors.concerns}</p> : null}
        <div>
          <Button type="button" variant="secondary" onClick={() => setComplaints([...complaints, ""])}>
            + Another concern
          </Button>
        </div>
      </fieldset>
      <fieldset className="grid gap-3 md:grid-cols-2">
        <legend className="mb-1 text-lg font-bold">At check-in</legend>
        <Field
          label="Odometer (mi)"
          name="odometer"
          defaultValue={setup.odometer}
          inputMode="numeric"
          error={errors.odometer}
          hint={setup.lastOdometer !== null ? `Last reading ${setup.lastOdometer.toLocaleString("en-US")} mi. A lower one is refused unless the meter was replaced.` : undefined}
        />
        <Field
          label="Engine hours"
          name="engineHours"
          defaultValue={setup.engineHours}
          inputMode="decimal"
          error={errors.engineHours}
          hint={setup.lastEngineHours !== null ? `Last reading ${setup.lastEngineHours.toLocaleString("en-US")} h.` : undefined}
        />
        <SelectField label="Technician" name="assignedTechId" defaultValue="" options={staffOptions(setup.staff, "Not assigned yet")} error={errors.assignedTechId} />
        <Field label="Promised by" name="promisedAt" type="datetime-local" error={errors.promisedAt} />
        <Field label={setup.poRequired ? "PO number (this account needs one to invoice)" : "PO number"} name="poNumber" error={errors.poNumber} />
      </fieldset>
      {setup.deferred.length ? (
        <fieldset className="rounded-card border-2 border-dashed border-ink-soft p-3">
          <legend className="px-1 font-bold">Deferred work on {setup.unitNumber}</legend>
          <p className="mb-2 text-sm text-ink-soft">Held or declined on earlier visits. Tick any to bring back as draft lines to price again.</p>
          {setup.deferred.map((d) => (
            <label key={d.id} className="flex min-h-touch items-center gap-3">
              <input type="checkbox" name="bringBackLineIds" value={d.id} className="size-5 accent-rust" />
              <span className="flex-1">
                {d.description}
                <span className="block text-xs text-ink-faint">
                  {d.state === "held" ? "Held for later" : "Declined"} on {d.woLabel}
                </span>
              </span>
              <Money cents={d.amountCents} />
            </label>
          ))}
        </fieldset>
      ) : null}
      <FormMessage result={state} />
      {inShop ? (
        <p>
          <Link href={inShop} className="font-bold">
            Open the visit it is on
          </Link>
        </p>
      ) : null}
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Checking in…" : `Check ${setup.unitNumber} in`}
        </Button>
      </div>
    </form>
  );
}
