"use client";

import { Field, FormMessage, SelectField } from "@/components/forms/field";
import { staffOptions } from "./staff-options";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { visitDetailsAction } from "@/lib/server/actions/visits";

/** Who works on the unit, when it is promised, the PO: each change is a dated entry on the fleet's timeline. */
export function VisitDetailsForm({
  workOrderId,
  staff,
  initial,
}: {
  workOrderId: string;
  staff: { id: string; name: string; role: string }[];
  initial: { assignedTechId: string; promisedAt: string; poNumber: string };
}) {
  const [state, action, pending, formRef] = useGuardedForm(visitDetailsAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <form ref={formRef} action={action} className="grid gap-3 sm:grid-cols-3" data-testid="visit-details">
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <SelectField label="Technician" name="assignedTechId" defaultValue={initial.assignedTechId} options={staffOptions(staff, "Not assigned")} error={errors.assignedTechId} />
      <Field label="Promised by" name="promisedAt" type="datetime-local" defaultValue={initial.promisedAt} error={errors.promisedAt} />
      <Field label="PO number" name="poNumber" defaultValue={initial.poNumber} error={errors.poNumber} />
      <div className="flex items-center gap-3 sm:col-span-3">
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Saving…" : "Save visit details"}
        </Button>
        {state?.ok ? <span role="status">{state.data.changed ? "Saved; the fleet sees each change on the timeline." : "Nothing changed."}</span> : null}
      </div>
      <div className="sm:col-span-3">
        <FormMessage result={state} />
      </div>
    </form>
  );
}
