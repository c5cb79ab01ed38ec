"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { shopSettingsAction } from "@/lib/server/actions/shop-settings";

export interface ShopFormValues {
  shopName: string;
  addressLine1: string;
  addressLine2: string;
  phone: string;
  email: string;
  shopSuppliesRate: string;
  shopSuppliesCap: string;
  shopSuppliesTaxable: boolean;
  taxLabor: boolean;
  taxParts: boolean;
  taxSublet: boolean;
  taxFees: boolean;
  invoiceFooter: string;
}

function Check({ name, label, checked }: { name: string; label: string; checked: boolean }) {
  return (
    <label className="flex min-h-touch items-center gap-2">
      <input type="checkbox" name={name} defaultChecked={checked} className="size-5 accent-rust" />
      {label}
    </label>
  );
}

/** The owner's shop settings: who we are, the shop-supplies fee, and which kinds of line are taxed. */
export function ShopSettingsForm({ initial }: { initial: ShopFormValues }) {
  const [state, action, pending, formRef] = useGuardedForm(shopSettingsAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-4">
      <div className="grid gap-3 md:grid-cols-2">
        <Field label="Shop name" name="shopName" defaultValue={initial.shopName} error={errors.shopName} />
        <Field label="E-mail" name="email" defaultValue={initial.email} />
        <Field label="Address" name="addressLine1" defaultValue={initial.addressLine1} />
        <Field label="Town" name="addressLine2" defaultValue={initial.addressLine2} />
        <Field label="Phone" name="phone" defaultValue={initial.phone} />
      </div>
      <fieldset className="grid gap-3 md:grid-cols-3">
        <legend className="mb-1 font-bold">Shop-supplies fee</legend>
        <Field label="Percent of labour" name="shopSuppliesRate" defaultValue={initial.shopSuppliesRate} inputMode="decimal" error={errors.shopSuppliesRate} />
        <Field label="At most ($ per work order)" name="shopSuppliesCap" defaultValue={initial.shopSuppliesCap} inputMode="decimal" error={errors.shopSuppliesCap} />
        <Check name="shopSuppliesTaxable" label="Shop supplies are taxable" checked={initial.shopSuppliesTaxable} />
      </fieldset>
      <fieldset className="flex flex-wrap gap-x-6">
        <legend className="mb-1 font-bold">Taxable kinds (the default for new lines; each line can differ)</legend>
        <Check name="taxLabor" label="Labour" checked={initial.taxLabor} />
        <Check name="taxParts" label="Parts" checked={initial.taxParts} />
        <Check name="taxSublet" label="Sublet" checked={initial.taxSublet} />
        <Check name="taxFees" label="Fees" checked={initial.taxFees} />
      </fieldset>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Invoice footer</span>
        <textarea name="invoiceFooter" defaultValue={initial.invoiceFooter} rows={2} className="rounded-card border-2 border-rule-strong bg-white p-2" />
      </label>
      <FormMessage result={state} />
      {state?.ok ? <p role="status">Saved.</p> : null}
      <div>
        <Button type="submit" disabled={pending}>
          Save shop settings
        </Button>
      </div>
    </form>
  );
}
