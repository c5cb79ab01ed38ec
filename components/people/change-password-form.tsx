"use client";

import { useEffect, useState } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { signInWith } from "@/components/auth/sign-in-after";
import { changePasswordAction } from "@/lib/actions/people";

/** Your own password. Changing it ends your other sessions; this browser signs in again with the new one. */
export function ChangePasswordForm() {
  const [state, action, pending, formRef] = useGuardedForm(changePasswordAction);
  const [done, setDone] = useState<string | null>(null);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  useEffect(() => {
    if (!state?.ok || !formRef.current) return;
    const form = formRef.current;
    const password = String(new FormData(form).get("newPassword") ?? "");
    void signInWith(state.data.email, password).then((ok) => {
      form.reset();
      setDone(ok ? "Password changed. You are signed out everywhere else." : "Password changed. Sign in again with the new one.");
    });
  }, [state, formRef]);
  return (
    <form ref={formRef} action={action} className="flex max-w-md flex-col gap-3" data-testid="change-password">
      <Field label="Current password" name="currentPassword" type="password" autoComplete="current-password" error={errors.currentPassword} />
      <Field label="New password" name="newPassword" type="password" autoComplete="new-password" error={errors.newPassword} hint="At least 10 characters." />
      <Field label="New password again" name="confirmPassword" type="password" autoComplete="new-password" error={errors.confirmPassword} />
      <FormMessage result={state} />
      {done ? (
        <p role="status" className="font-semibold">
          {done}
        </p>
      ) : null}
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Change password"}
        </Button>
      </div>
    </form>
  );
}
