"use client";

import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { setupAction } from "@/lib/server/actions/public";
import { useSignInAfter } from "./use-sign-in-after";

/** The one-time set-up of an empty Cotter: the shop, its labour rate, and its owner. */
export function SetupForm() {
  const [state, action, pending, formRef] = useGuardedForm(setupAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const { signing, onSubmit } = useSignInAfter(state, "password", (ok) => window.location.assign(ok ? "/settings/people" : "/sign-in"));
  return (
    <form ref={formRef} action={action} onSubmit={onSubmit} className="flex flex-col gap-4" data-testid="setup-form">
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-lg font-bold">The shop</legend>
        <Field label="Shop name" name="shopName" autoComplete="organization" error={errors.shopName} />
        <Field label="Street address" name="addressLine1" autoComplete="address-line1" error={errors.addressLine1} />
        <Field label="Town, state and ZIP" name="addressLine2" autoComplete="address-line2" error={errors.addressLine2} />
        <Field label="Phone" name="phone" type="tel" autoComplete="tel" error={errors.phone} />
        <Field label="Shop e-mail (optional)" name="shopEmail" type="email" error={errors.shopEmail} hint="Printed on invoices; the owner's e-mail if left empty." />
        <Field label="Labour rate ($ per hour)" name="laborRate" inputMode="decimal" error={errors.laborRate ?? errors.laborRateCents} hint="More rates (diagnosis, field service) can be added later in Settings." />
      </fieldset>
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-lg font-bold">You, the owner</legend>
        <Field label="Your name" name="ownerName" autoComplete="name" error={errors.ownerName} />
        <Field label="Your e-mail" name="ownerEmail" type="email" autoComplete="username" error={errors.ownerEmail} />
        <Field label="Choose a password" name="password" type="password" autoComplete="new-password" error={errors.password} hint="At least 10 characters." />
        <Field label="The same password again" name="confirmPassword" type="password" autoComplete="new-password" error={errors.confirmPassword} />
      </fieldset>
      <FormMessage result={state} />
      <Button type="submit" disabled={pending || signing}>
        {pending ? "Setting up…" : signing ? "Signing you in…" : "Set up Cotter"}
      </Button>
    </form>
  );
}
