"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { Money } from "@/components/ui/money";
import { issueInvoiceAction } from "@/lib/server/actions/invoices";

export function IssueInvoiceForm({
  workOrderId,
  poNumber,
  poRequired,
  accountName,
  totalCents,
  replaces,
}: {
  workOrderId: string;
  poNumber: string | null;
  poRequired: boolean;
  accountName: string;
  totalCents: number;
  replaces: string | null;
}) {
  const [state, formAction, pending, formRef] = useGuardedForm(issueInvoiceAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form ref={formRef} action={formAction} className="flex flex-col gap-3" data-testid="issue-invoice">
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <Field
        label={poRequired ? "PO number (required)" : "PO number (optional)"}
        name="poNumber"
        defaultValue={poNumber ?? ""}
        required={poRequired}
        maxLength={60}
        hint={poRequired ? `${accountName} requires a PO number on every invoice; their clerk can also enter it.` : undefined}
        error={errors?.poNumber}
      />
      <FormMessage result={state} />
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Issuing…" : (
            <>
              Issue invoice for <Money cents={totalCents} />
            </>
          )}
        </Button>
      </div>
      <p className="text-sm text-ink-faint">
        {replaces ? `Replaces ${replaces} (void). ` : ""}Once issued, the invoice does not change; it is e-mailed to the account with the PDF and a link to pay.
      </p>
    </form>
  );
}
