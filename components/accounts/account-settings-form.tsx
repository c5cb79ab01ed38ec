"use client";

import { useState } from "react";
import { Field, FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { updateAccountAction } from "@/lib/actions/accounts";

export interface AccountFormValues {
  accountId: string;
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

// Overrun shapes from state consumer-repair laws (reference-values.md). They are
// starting points for a contract setting, not legal advice for fleets.
const SHAPES = [
  { label: "Cotter default: 10 %, at most $50", percent: "10", cap: "50.00", floor: "0.00" },
  { label: "Florida 559.909(1)(b): $10 or 10 %, the greater, at most $50", percent: "10", cap: "50.00", floor: "10.00" },
  { label: "Michigan 1974 PA 300: $10 or 10 %, the lesser", percent: "10", cap: "10.00", floor: "0.00" },
  { label: "Maryland 14-1002(b) / Minnesota 325F.61(c): 10 %", percent: "10", cap: "", floor: "0.00" },
  { label: "California 9884.9(a): none — every increase needs consent", percent: "0", cap: "0.00", floor: "0.00" },
];

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

export function AccountSettingsForm({ initial }: { initial: AccountFormValues }) {
  const [state, action, pending, formRef] = useGuardedForm(updateAccountAction);
  const [overrun, setOverrun] = useState({ percent: initial.overrunPercent, cap: initial.overrunCap, floor: initial.overrunFloor });
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-5" data-testid="account-settings">
      <input type="hidden" name="accountId" value={initial.accountId} />
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
          When the shop revises an approved line upward, the approval holds only within this allowance: the percent of the approved amount, at least the floor and at most the cap. Beyond it the line goes back to the approver.
        </p>
        <div className="flex flex-wrap gap-2">
          {SHAPES.map((s) => (
            <button key={s.label} type="button" className="min-h-touch rounded-card border border-rule-strong bg-white px-3 text-left text-sm hover:border-ink" onClick={() => setOverrun({ percent: s.percent, cap: s.cap, floor: s.floor })}>
              {s.label}
            </button>
          ))}
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
          <input type="checkbox" name="taxExempt" defaultChecked={initial.taxExempt} className="size-5 accent-rust" />
          Tax exempt
        </label>
        <Field label="Exemption certificate number" name="taxExemptCertificate" defaultValue={initial.taxExemptCertificate} error={errors.taxExemptCertificate} />
        <Field label="Tax rate (%)" name="taxRate" defaultValue={initial.taxRate} inputMode="decimal" error={errors.taxRate} />
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
      {state?.ok ? (
        <p role="status" className="font-semibold">
          {state.data.changed ? `Saved ${state.data.changed} change${state.data.changed === 1 ? "" : "s"}; each is in the change log below.` : "Nothing changed."}
        </p>
      ) : null}
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Save account settings"}
        </Button>
      </div>
    </form>
  );
}
