"use client";

import { useActionState } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import type { ActionResult } from "@/lib/auth/guarded-action";
import { setPoNumberAction } from "@/lib/actions/invoices";

type State = ActionResult<{ poNumber: string }> | null;

/** The fleet enters the PO number a work order needs before the shop can invoice it. */
export function PoNumberForm({ workOrderId, label }: { workOrderId: string; label: string }) {
  const [state, formAction, pending] = useActionState<State, FormData>((_prev, form) => setPoNumberAction(form), null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  if (state?.ok) {
    return (
      <p role="status" className="text-sm font-semibold">
        PO {state.data.poNumber} saved on {label}. The shop can now invoice it.
      </p>
    );
  }
  return (
    <form action={formAction} className="flex flex-wrap items-end gap-2" data-testid="po-form">
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <Field label={`PO number for ${label}`} name="poNumber" required maxLength={60} error={errors?.poNumber} className="min-w-0 flex-1" />
      <Button type="submit" disabled={pending}>
        {pending ? "Saving…" : "Save PO"}
      </Button>
      <FormMessage result={state} />
    </form>
  );
}
