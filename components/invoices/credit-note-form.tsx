"use client";

import { useActionState } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import type { ActionResult } from "@/lib/auth/guarded-action";
import { creditNoteAction } from "@/lib/actions/invoices";
import { formatCents } from "@/lib/money";

type State = ActionResult<{ label: string; balanceCents: number }> | null;

/** A numbered credit against an issued invoice, up to what is still owed; the invoice itself stays as issued. */
export function CreditNoteForm({ invoiceId, balanceCents }: { invoiceId: string; balanceCents: number }) {
  const [state, formAction, pending] = useActionState<State, FormData>((_prev, form) => creditNoteAction(form), null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={formAction} className="flex flex-col gap-3" data-testid="credit-note">
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
