"use client";

import { useState } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { useSignInAfter } from "@/components/auth/use-sign-in-after";
import { changePasswordAction } from "@/lib/server/actions/people";

/** Your own password. Changing it ends your other sessions; this browser signs in again with the new one. */
export function ChangePasswordForm() {
  const [state, action, pending, formRef] = useGuardedForm(changePasswordAction);
  const [done, setDone] = useState<string | null>(null);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const { onSubmit } = useSignInAfter(state, "newPassword", (ok) => {
    formRef.current?.reset();
    setDone(ok ? "Password changed. You are signed out everywhere else." : "Password changed. Sign in again with the new one.");
  });
  return (
    <form ref={formRef} action={action} onSubmit={onSubmit} className="flex max-w-md flex-col gap-3" data-testid="change-password">
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
