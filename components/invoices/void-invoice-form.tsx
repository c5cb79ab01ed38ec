"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { voidInvoiceAction } from "@/lib/server/actions/invoices";

/** Voiding keeps the invoice and its number; the work order can then be invoiced again. */
export function VoidInvoiceForm({ invoiceId, label }: { invoiceId: string; label: string }) {
  const [state, formAction, pending, formRef] = useGuardedForm(voidInvoiceAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form ref={formRef} action={formAction} className="flex flex-col gap-3" data-testid="void-invoice">
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <p className="text-sm text-ink-soft">
        {label} stays on record, marked void, and keeps its number. Issue the corrected invoice from the work order afterwards.
      </p>
      <Field label="Why is it void?" name="reason" required minLength={3} maxLength={500} error={errors?.reason} />
      <FormMessage result={state} />
      <div>
        <Button type="submit" variant="danger" disabled={pending}>
          {pending ? "Voiding…" : `Void ${label}`}
        </Button>
      </div>
    </form>
  );
}
