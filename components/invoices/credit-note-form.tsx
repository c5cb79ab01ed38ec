"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { creditNoteAction } from "@/lib/server/actions/invoices";
import { formatCents } from "@/lib/money";

/** A numbered credit against an issued invoice, up to what is still owed; the invoice itself stays as issued. */
export function CreditNoteForm({ invoiceId, balanceCents }: { invoiceId: string; balanceCents: number }) {
  const [state, formAction, pending, formRef] = useGuardedForm(creditNoteAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form ref={formRef} action={formAction} className="flex flex-col gap-3" data-testid="credit-note">
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <p className="text-sm text-ink-soft">
        For a price put right or a core that came back after money was paid. Up to the {formatCents(balanceCents)} still owed; a refund is settled with the
        account directly.
      </p>
      <Field label="Credit ($)" name="amount" inputMode="decimal" required error={errors?.amount} />
      <Field label="What it is for" name="reason" required minLength={3} maxLength={300} error={errors?.reason} />
      <FormMessage result={state} />
      {state?.ok ? (
        <p role="status" className="text-sm font-semibold">
          {state.data.label} issued.
        </p>
      ) : null}
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Issuing…" : "Issue credit note"}
        </Button>
      </div>
    </form>
  );
}
