"use client";

import { FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { resolvePaymentAction } from "@/lib/server/actions/invoices";

/** The shop's decision on a card payment held for review. */
export function HeldPaymentActions({ paymentId, canApply }: { paymentId: string; canApply: boolean }) {
  const [state, formAction, pending, formRef] = useGuardedForm(resolvePaymentAction);
  return (
    <form ref={formRef} action={formAction} className="flex flex-wrap items-center gap-2">
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
