"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { requestResetAction } from "@/lib/server/actions/public";

export function ForgotPasswordForm() {
  const [state, action, pending, formRef] = useGuardedForm(requestResetAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  if (state?.ok) {
    return (
      <p role="status" className="rounded-card border-2 border-ink bg-paper p-3">
        If someone signs in to Cotter with that address, a link to choose a new password is on its way. It works once, for one hour. Check the spam folder if it does not arrive.
      </p>
    );
  }
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-4">
      <Field label="E-mail" name="email" type="email" autoComplete="username" error={errors.email} />
      <FormMessage result={state} />
      <Button type="submit" disabled={pending}>
        {pending ? "Sending…" : "Send me a link"}
      </Button>
    </form>
  );
}
