"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { Field, FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { saveAccountAction } from "@/lib/server/actions/accounts";
import { OVERRUN_SHAPES } from "./overrun-shapes";

export interface AccountFormValues {
  accountId: string;
  name: string;
  billingEmail: string;
  address: string;
  phone: string;
  standingAuthorisation: string;
  repairBudget: string;
  fiscalYearStartMonth: number;
  overrunPercent: string;
  overrunCap: string;
  overrunFloor: string;
  taxExempt: boolean;
  taxExemptCertificate: string;
  taxRate: string;
  poRequired: boolean;
  paymentTermsDays: number;
  shopSuppliesExempt: boolean;
}

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

/** A fleet account's name, billing, limits and terms: a new account when accountId is empty. */
export function AccountForm({ initial }: { initial: AccountFormValues }) {
  const router = useRouter();
  const [state, action, pending, formRef] = useGuardedForm(saveAccountAction);
  const [overrun, setOverrun] = useState({ percent: initial.overrunPercent, cap: initial.overrunCap, floor: initial.overrunFloor });
  const [taxExempt, setTaxExempt] = useState(initial.taxExempt);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const isNew = !initial.accountId;
  useEffect(() => {
    if (state?.ok && state.data.created) router.push(`/accounts/${state.data.accountId}`);
  }, [state, router]);
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-5" data-testid="account-form">
      <input type="hidden" name="accountId" value={initial.accountId} />
      <fieldset className="grid gap-3 md:grid-cols-2">
        <legend className="mb-2 text-lg font-bold">The account</legend>
        <Field label="Account name" name="name" defaultValue={initial.name} error={errors.name} />
        <Field label="Billing e-mail" name="billingEmail" type="email" defaultValue={initial.billingEmail} error={errors.billingEmail} hint="Invoices and receipts go here (and to the account's clerks)." />
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Billing address</span>
          <textarea name="address" defaultValue={initial.address} rows={3} className={`${inputClass} py-2`} />
        </label>
        <Field label="Phone" name="phone" type="tel" defaultValue={initial.phone} error={errors.phone} />
      </fieldset>
      <fieldset className="grid gap-3 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Spending limits</legend>
        <Field label="Standing authorisation ($ per work order)" name="standingAuthorisation" defaultValue={initial.standingAuthorisation} inputMode="decimal" error={errors.standingAuthorisation} hint="The shop may start work up to this without asking." />
        <Field label="Repair budget ($ per fiscal year)" name="repairBudget" defaultValue={initial.repairBudget} inputMode="decimal" error={errors.repairBudget} hint="Leave empty for no budget." />
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Fiscal year starts in</span>
          <select name="fiscalYearStartMonth" defaultValue={initial.fiscalYearStartMonth} className={inputClass}>
            {MONTHS.map((m, i) => (
              <option key={m} value={i + 1}>
                {m}
              </option>
            ))}
          </select>
        </label>
      </fieldset>
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold">Overrun allowance</legend>
        <p className="text-sm text-ink-soft">
          When the shop revises an approved line upward, the approval holds only within this allowance: the percent of the approved amount, at least the floor and at most the cap. Beyond it the line goes back to the approver. The shapes below come from state consumer-repair laws; for a fleet the allowance is a contract setting, not legal advice.
        </p>
        <div className="flex flex-wrap gap-2">
          {OVERRUN_SHAPES.map((s) => {
            const on = s.percent === overrun.percent && s.cap === overrun.cap && s.floor === overrun.floor;
            return (
              <button
                key={s.label}
                type="button"
                aria-pressed={on}
                className={`min-h-touch rounded-card border-2 px-3 text-left text-sm ${on ? "border-ink bg-paper-deep font-semibold" : "border-rule-strong bg-white hover:border-ink"}`}
                onClick={() => setOverrun({ percent: s.percent, cap: s.cap, floor: s.floor })}
              >
                {s.label}
              </button>
            );
          })}
        </div>
        <div className="grid gap-3 md:grid-cols-3">
          <Field label="Percent of the approved amount" name="overrunPercent" value={overrun.percent} onChange={(e) => setOverrun({ ...overrun, percent: e.target.value })} inputMode="decimal" error={errors.overrunPercent} />
          <Field label="Cap ($, empty for none)" name="overrunCap" value={overrun.cap} onChange={(e) => setOverrun({ ...overrun, cap: e.target.value })} inputMode="decimal" error={errors.overrunCap} />
          <Field label="Floor ($)" name="overrunFloor" value={overrun.floor} onChange={(e) => setOverrun({ ...overrun, floor: e.target.value })} inputMode="decimal" error={errors.overrunFloor} />
        </div>
      </fieldset>
      <fieldset className="grid gap-3 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Tax, PO and terms</legend>
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" name="taxExempt" checked={taxExempt} onChange={(e) => setTaxExempt(e.target.checked)} className="size-5 accent-rust" />
          Tax exempt
        </label>
        {taxExempt ? (
          <Field label="Exemption certificate number" name="taxExemptCertificate" defaultValue={initial.taxExemptCertificate} error={errors.taxExemptCertificate} />
        ) : (
          <Field label="Tax rate (%)" name="taxRate" defaultValue={initial.taxRate} inputMode="decimal" error={errors.taxRate} />
        )}
        {taxExempt ? <input type="hidden" name="taxRate" value={initial.taxRate || "0"} /> : <input type="hidden" name="taxExemptCertificate" value="" />}
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" name="poRequired" defaultChecked={initial.poRequired} className="size-5 accent-rust" />
          PO number required to invoice
        </label>
        <Field label="Payment terms (days)" name="paymentTermsDays" defaultValue={initial.paymentTermsDays} inputMode="numeric" error={errors.paymentTermsDays} />
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" name="shopSuppliesExempt" defaultChecked={initial.shopSuppliesExempt} className="size-5 accent-rust" />
          No shop-supplies fee
        </label>
      </fieldset>
      <FormMessage result={state} />
      {state?.ok && !state.data.created ? (
        <p role="status" className="font-semibold">
          {state.data.changed ? `Saved ${state.data.changed} change${state.data.changed === 1 ? "" : "s"}; each is in the change log below.` : "Nothing changed."}
        </p>
      ) : null}
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : isNew ? "Create the account" : "Save account settings"}
        </Button>
      </div>
    </form>
  );
}
