"use client";

import { inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { laborRateAction } from "@/lib/server/actions/shop-settings";

/** One labour rate (or a blank one to add). */
export function LaborRateRow({ rate }: { rate?: { id: string; name: string; rate: string; isDefault: boolean; active: boolean } }) {
  const [state, action, pending, formRef] = useGuardedForm(laborRateAction);
  return (
    <form ref={formRef} action={action} className="flex flex-wrap items-end gap-3 border-t border-rule py-2">
      <input type="hidden" name="id" value={rate?.id ?? ""} />
      <label className="flex flex-col gap-1">
        <span className="text-sm font-semibold">Name</span>
        <input name="name" defaultValue={rate?.name ?? ""} className={`${inputClass} w-48`} placeholder="New rate" />
      </label>
      <label className="flex flex-col gap-1">
        <span className="text-sm font-semibold">$ per hour</span>
        <input name="rate" defaultValue={rate?.rate ?? ""} inputMode="decimal" className={`${inputClass} figures w-32`} />
      </label>
      <label className="flex min-h-touch items-center gap-2">
        <input type="checkbox" name="isDefault" defaultChecked={rate?.isDefault ?? false} className="size-5 accent-rust" />
        Default
      </label>
      <label className="flex min-h-touch items-center gap-2">
        <input type="checkbox" name="active" defaultChecked={rate?.active ?? true} className="size-5 accent-rust" />
        In use
      </label>
      <Button type="submit" variant="secondary" disabled={pending}>
        {rate ? "Save" : "Add rate"}
      </Button>
      {state && !state.ok ? <p className="w-full text-sm font-semibold text-rust-deep">{state.error}</p> : null}
    </form>
  );
}
