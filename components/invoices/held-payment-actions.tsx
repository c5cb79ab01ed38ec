"use client";

import { useActionState } from "react";
import { FormMessage } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import type { ActionResult } from "@/lib/auth/guarded-action";
import { resolvePaymentAction } from "@/lib/actions/invoices";

type State = ActionResult<{ invoiceId: string }> | null;

/** The shop's decision on a card payment held for review. */
export function HeldPaymentActions({ paymentId, canApply }: { paymentId: string; canApply: boolean }) {
  const [state, formAction, pending] = useActionState<State, FormData>((_prev, form) => resolvePaymentAction(form), null);
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="paymentId" value={paymentId} />
      {canApply ? (
        <Button type="submit" name="resolution" value="applied" variant="secondary" disabled={pending}>
          Apply to this invoice
        </Button>
      ) : null}
      <Button type="submit" name="resolution" value="returned" variant="quiet" disabled={pending}>
        Mark as returned to the payer
      </Button>
      <FormMessage result={state} />
    </form>
  );
}
