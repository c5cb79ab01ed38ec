"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { acceptInvitationAction, completeResetAction } from "@/lib/server/actions/public";
import { useSignInAfter } from "./use-sign-in-after";

/** Choose a password from an e-mailed link (an invitation or a reset), then go straight in. */
export function NewPasswordForm({ token, purpose }: { token: string; purpose: "invitation" | "reset" }) {
  const [state, action, pending, formRef] = useGuardedForm(purpose === "invitation" ? acceptInvitationAction : completeResetAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const { signing, onSubmit } = useSignInAfter(state, "password", (ok) => window.location.assign(ok ? "/" : "/sign-in"));
  return (
    <form ref={formRef} action={action} onSubmit={onSubmit} className="flex flex-col gap-4">
      <input type="hidden" name="token" value={token} />
      <Field label="Choose a password" name="password" type="password" autoComplete="new-password" error={errors.password} hint="At least 10 characters. Only you will know it." />
      <Field label="The same password again" name="confirmPassword" type="password" autoComplete="new-password" error={errors.confirmPassword} />
      <FormMessage result={state} />
      <Button type="submit" disabled={pending || signing}>
        {pending ? "Saving…" : signing ? "Signing you in…" : purpose === "invitation" ? "Save my password and sign in" : "Save the new password"}
      </Button>
    </form>
  );
}
