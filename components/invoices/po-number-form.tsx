"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { setPoNumberAction } from "@/lib/server/actions/invoices";

/** The fleet enters the PO number a work order needs before the shop can invoice it. */
export function PoNumberForm({ workOrderId, label }: { workOrderId: string; label: string }) {
  const [state, formAction, pending, formRef] = useGuardedForm(setPoNumberAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  if (state?.ok) {
    return (
      <p role="status" className="text-sm font-semibold">
        PO {state.data.poNumber} saved on {label}. The shop can now invoice it.
      </p>
    );
  }
  return (
    <form ref={formRef} action={formAction} className="flex flex-wrap items-end gap-2" data-testid="po-form">
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <Field label={`PO number for ${label}`} name="poNumber" required maxLength={60} error={errors?.poNumber} className="min-w-0 flex-1" />
      <Button type="submit" disabled={pending}>
        {pending ? "Saving…" : "Save PO"}
      </Button>
      <FormMessage result={state} />
    </form>
  );
}
