"use client";

import { useActionState } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { Money } from "@/components/ui/money";
import type { ActionResult } from "@/lib/auth/guarded-action";
import { issueInvoiceAction } from "@/lib/actions/invoices";

type State = ActionResult<never> | null;

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
  const [state, formAction, pending] = useActionState<State, FormData>((_prev, form) => issueInvoiceAction(form), null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={formAction} className="flex flex-col gap-3" data-testid="issue-invoice">
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
