"use client";

import { useRouter } from "next/navigation";
import { useEffect } from "react";
import { Field, FormMessage, SelectField } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { createUnitAction, editUnitAction } from "@/lib/server/actions/units";
import { INSPECTION_BASES, INSPECTION_BASIS_LABELS } from "@/lib/domain";
import { VinField } from "./vin-field";

export interface UnitFormValues {
  unitId: string;
  accountId: string;
  unitNumber: string;
  vin: string;
  serialOnly: boolean;
  serial: string;
  year: string;
  description: string;
  plate: string;
  lastInspectionOn: string;
  inspectionBasis: string;
  keyOffDrainLimitMa: string;
  lastOdometer: number | null;
  lastEngineHours: number | null;
}

/** Adds a unit to an account (no unitId) or edits one. */
export function UnitForm({ initial, accounts }: { initial: UnitFormValues; accounts?: { id: string; name: string }[] }) {
  const router = useRouter();
  const isNew = !initial.unitId;
  const [state, action, pending, formRef] = useGuardedForm(isNew ? createUnitAction : editUnitAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  useEffect(() => {
    if (state?.ok) router.push(`/units/${state.data.unitId}`);
  }, [state, router]);
  return (
    <form ref={formRef} action={action} className="grid gap-4 md:grid-cols-2" data-testid="unit-form">
      {isNew ? null : <input type="hidden" name="unitId" value={initial.unitId} />}
      {isNew && accounts ? (
        <SelectField label="Fleet account" name="accountId" defaultValue={initial.accountId} className="md:col-span-2" options={[["", "Choose…"], ...accounts.map((a) => [a.id, a.name] as const)]} error={errors.accountId} />
      ) : isNew ? (
        <input type="hidden" name="accountId" value={initial.accountId} />
      ) : null}
      <Field label="Unit number" name="unitNumber" defaultValue={initial.unitNumber} error={errors.unitNumber} hint="The fleet's own number, e.g. T-14." />
      <Field label="Model year" name="year" defaultValue={initial.year} inputMode="numeric" error={errors.year} />
      <VinField vin={initial.vin} serialOnly={initial.serialOnly} serial={initial.serial} errors={errors} />
      <Field label="Description" name="description" defaultValue={initial.description} error={errors.description} className="md:col-span-2" hint="Body and equipment, e.g. tandem-axle dump with front plow and side wing." />
      <Field label="Plate" name="plate" defaultValue={initial.plate} error={errors.plate} />
      <div />
      <Field
        label="Odometer (mi)"
        name="odometer"
        inputMode="numeric"
        error={errors.odometer}
        hint={initial.lastOdometer !== null ? `Last reading ${initial.lastOdometer.toLocaleString("en-US")} mi; leave empty for no new reading.` : "Today's reading, if known."}
      />
      <Field
        label="Engine hours"
        name="engineHours"
        inputMode="decimal"
        error={errors.engineHours}
        hint={initial.lastEngineHours !== null ? `Last reading ${initial.lastEngineHours.toLocaleString("en-US")} h; leave empty for no new reading.` : "Today's reading, if known."}
      />
      <Field label="Last annual inspection" name="lastInspectionOn" type="date" defaultValue={initial.lastInspectionOn} error={errors.lastInspectionOn} />
      <SelectField label="Inspected under" name="inspectionBasis" defaultValue={initial.inspectionBasis} options={[["", "Not recorded"], ...INSPECTION_BASES.map((b) => [b, INSPECTION_BASIS_LABELS[b]] as const)]} error={errors.inspectionBasis} />
      <Field
        label="Accepted key-off drain (mA)"
        name="keyOffDrainLimitMa"
        inputMode="numeric"
        defaultValue={initial.keyOffDrainLimitMa}
        error={errors.keyOffDrainLimitMa}
        hint="The figure this unit's maker accepts; later drain readings are judged against it. Empty: the usual 50 mA warning (common practice)."
      />
      <div className="md:col-span-2">
        <FormMessage result={state} />
        <Button type="submit" disabled={pending} className="mt-2">
          {pending ? "Saving…" : isNew ? "Add the unit" : "Save the unit"}
        </Button>
      </div>
    </form>
  );
}
