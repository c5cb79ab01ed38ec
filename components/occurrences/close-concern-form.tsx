"use client";

import { FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { closeConcernAction } from "@/lib/server/actions/intermittent-concerns";


/** Closes the concern with the cause found; the fleet reads this as the shop's conclusion. */
export function CloseConcernForm({ concernId }: { concernId: string }) {
  const [state, action, pending, formRef] = useGuardedForm(closeConcernAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <details className="rounded-card border border-rule bg-paper p-3">
      <summary className="min-h-touch cursor-pointer py-2 font-bold">Cause found: close this concern</summary>
      <form ref={formRef} action={action} className="mt-2 flex flex-col gap-3" data-testid="close-concern-form">
        <input type="hidden" name="concernId" value={concernId} />
        <label className="flex flex-col gap-1">
          <span className="font-semibold">What the cause was and what was done (the fleet sees this)</span>
          <textarea
            name="conclusion"
            rows={3}
            required
            aria-invalid={errors?.conclusion ? true : undefined}
            className={`${inputClass} py-2`}
            placeholder="e.g. Key-off drain of 310 mA from the spreader controller; rewired it to the ignition circuit and retested at 35 mA."
          />
          {errors?.conclusion ? <span className="text-sm font-semibold text-rust-deep">{errors.conclusion}</span> : null}
        </label>
        <FormMessage result={state} />
        <div>
          <Button type="submit" disabled={pending}>
            {pending ? "Closing…" : "Close the concern"}
          </Button>
        </div>
      </form>
    </details>
  );
}
