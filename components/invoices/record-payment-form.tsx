"use client";

import { useState } from "react";
import { Field, FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { recordPaymentAction } from "@/lib/server/actions/invoices";
import { decimalDollars } from "@/lib/invoices/csv";


/** A cheque, transfer or cash payment, whole or in part. */
export function RecordPaymentForm({ invoiceId, balanceCents, today }: { invoiceId: string; balanceCents: number; today: string }) {
  const [method, setMethod] = useState("cheque");
  // The amount offered follows the balance after a payment or a credit (React's "adjust state when a prop changes").
  const [offeredFor, setOfferedFor] = useState(balanceCents);
  const [amount, setAmount] = useState(decimalDollars(balanceCents));
  if (offeredFor !== balanceCents) {
    setOfferedFor(balanceCents);
    setAmount(decimalDollars(balanceCents));
  }
  const [state, formAction, pending, formRef] = useGuardedForm(recordPaymentAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form ref={formRef} action={formAction} className="flex flex-col gap-3" data-testid="record-payment">
      <input type="hidden" name="invoiceId" value={invoiceId} />
      <label className="flex flex-col gap-1">
        <span className="font-semibold">How it arrived</span>
        <select name="method" className={inputClass} value={method} onChange={(e) => setMethod(e.target.value)}>
          <option value="cheque">Cheque</option>
          <option value="transfer">Bank transfer</option>
          <option value="cash">Cash</option>
        </select>
      </label>
      <div className="grid gap-3">
        <Field label="Amount ($)" name="amount" inputMode="decimal" required value={amount} onChange={(e) => setAmount(e.target.value)} error={errors?.amount} />
        <Field label="Received on" name="receivedOn" type="date" required defaultValue={today} max={today} error={errors?.receivedOn} />
      </div>
      <Field
        label={method === "cheque" ? "Cheque number" : method === "transfer" ? "Transfer reference" : "Reference (optional)"}
        name="reference"
        required={method !== "cash"}
        error={errors?.reference}
      />
      <FormMessage result={state} />
      {state?.ok ? (
        <p role="status" className="text-sm font-semibold">
          Payment recorded{state.data.status === "paid" ? "; the invoice is paid in full" : ""}. A receipt is on its way to the account.
        </p>
      ) : null}
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Recording…" : "Record payment"}
        </Button>
      </div>
    </form>
  );
}
