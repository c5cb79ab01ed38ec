"use client";

import { useEffect, useState } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { acceptInvitationAction, completeResetAction } from "@/lib/actions/public";
import { signInWith } from "./sign-in-after";

/** Choose a password from an e-mailed link (an invitation or a reset), then go straight in. */
export function NewPasswordForm({ token, purpose }: { token: string; purpose: "invitation" | "reset" }) {
  const [state, action, pending, formRef] = useGuardedForm(purpose === "invitation" ? acceptInvitationAction : completeResetAction);
  const [signing, setSigning] = useState(false);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  useEffect(() => {
    if (!state?.ok || !formRef.current) return;
    const password = String(new FormData(formRef.current).get("password") ?? "");
    setSigning(true);
    void signInWith(state.data.email, password).then((ok) => window.location.assign(ok ? "/" : "/sign-in"));
  }, [state, formRef]);
  return (
    <form ref={formRef} action={action} className="flex flex-col gap-4">
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
