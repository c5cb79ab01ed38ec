"use client";

import { FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { markIntermittentAction } from "@/lib/server/actions/intermittent-concerns";


export const RECORD_HINT_EXAMPLE =
  "Note how long it sat and the outside temperature; if you can, read battery voltage before cranking.";

/** Marks a concern intermittent (or changes what to record): the fleet then logs each time it happens. */
export function MarkIntermittentForm({
  concerns,
  concernId,
  currentHint = "",
  submitLabel = "Mark intermittent and ask the fleet to log it",
}: {
  concerns?: { id: string; complaint: string }[];
  concernId?: string;
  currentHint?: string;
  submitLabel?: string;
}) {
  const [state, action, pending, formRef] = useGuardedForm(markIntermittentAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-3" data-testid="mark-intermittent-form">
      {concernId ? (
        <input type="hidden" name="concernId" value={concernId} />
      ) : (
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Concern</span>
          <select name="concernId" className={inputClass} required>
            {(concerns ?? []).map((c) => (
              <option key={c.id} value={c.id}>
                {c.complaint}
              </option>
            ))}
          </select>
        </label>
      )}
      <label className="flex flex-col gap-1">
        <span className="font-semibold">What the fleet should record each time</span>
        <textarea
          name="recordHint"
          rows={3}
          required
          defaultValue={currentHint}
          placeholder={RECORD_HINT_EXAMPLE}
          aria-invalid={errors?.recordHint ? true : undefined}
          className={`${inputClass} py-2`}
        />
        {errors?.recordHint ? <span className="text-sm font-semibold text-rust-deep">{errors.recordHint}</span> : null}
      </label>
      <FormMessage result={state} />
      {state?.ok ? (
        <p role="status" className="text-sm font-semibold">
          Saved. The fleet sees it on the unit and can log each time it happens
          {state.data.adopted ? `; ${state.data.adopted} earlier ${state.data.adopted === 1 ? "entry was" : "entries were"} attached` : ""}.
        </p>
      ) : null}
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Saving…" : submitLabel}
        </Button>
      </div>
    </form>
  );
}
