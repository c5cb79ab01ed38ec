"use client";

import { inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { signingLimitAction } from "@/lib/server/actions/accounts";

/** One approver's signing limit, editable in place. */
export function SigningLimitRow({ userId, name, email, limit }: { userId: string; name: string; email: string; limit: string }) {
  const [state, action, pending, formRef] = useGuardedForm(signingLimitAction);
  return (
    <form ref={formRef} action={action} className="flex flex-wrap items-end gap-3 border-t border-rule py-2">
      <input type="hidden" name="userId" value={userId} />
      <div className="min-w-48 flex-1">
        <p className="font-semibold">{name}</p>
        <p className="text-sm text-ink-faint">{email}</p>
      </div>
      <label className="flex flex-col gap-1">
        <span className="text-sm font-semibold">Signing limit ($ per work order)</span>
        <input name="signingLimit" defaultValue={limit} inputMode="decimal" className={`${inputClass} figures w-40`} />
      </label>
      <Button type="submit" variant="secondary" disabled={pending}>
        Save
      </Button>
      {state && !state.ok ? <p className="w-full text-sm font-semibold text-rust-deep">{state.error} {Object.values(state.fieldErrors ?? {}).join(" ")}</p> : null}
      {state?.ok ? <p className="w-full text-sm">Saved.</p> : null}
    </form>
  );
}
