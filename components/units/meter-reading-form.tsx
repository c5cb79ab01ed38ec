"use client";

import { Field, FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { addMeterReadingAction } from "@/lib/server/actions/meter-readings";

export function MeterReadingForm({ unitId }: { unitId: string }) {
  const [state, formAction, pending, formRef] = useGuardedForm(addMeterReadingAction);
  const fieldErrors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form ref={formRef} action={formAction} className="flex flex-col gap-3" data-testid="meter-form">
      <input type="hidden" name="unitId" value={unitId} />
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Meter</span>
          <select name="kind" className={inputClass} defaultValue="odometer">
            <option value="odometer">Odometer (mi)</option>
            <option value="engine_hours">Engine hours (h)</option>
          </select>
        </label>
        <Field label="Reading" name="value" inputMode="decimal" required error={fieldErrors?.value} />
      </div>
      <label className="flex min-h-touch items-center gap-2">
        <input type="checkbox" name="meterReplaced" className="size-5 accent-rust" />
        <span>The meter was replaced (a lower reading is expected)</span>
      </label>
      <FormMessage result={state} />
      {state?.ok ? <p role="status" className="text-sm font-semibold">Reading saved.</p> : null}
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Saving…" : "Add reading"}
        </Button>
      </div>
    </form>
  );
}
