"use client";

import { useState } from "react";
import { Field, FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { addPersonAction } from "@/lib/actions/people";
import { ROLE_LABELS, ROLES, isShopRole, type Role } from "@/lib/domain";

export function AddPersonForm({ accounts }: { accounts: { id: string; name: string }[] }) {
  const [state, action, pending, formRef] = useGuardedForm(addPersonAction);
  const [role, setRole] = useState<Role>("approver");
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <form ref={formRef} action={action} className="grid gap-3 md:grid-cols-3">
      <Field label="Name" name="name" error={errors.name} />
      <Field label="E-mail" name="email" type="email" error={errors.email} />
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Role</span>
        <select name="role" value={role} onChange={(e) => setRole(e.target.value as Role)} className={inputClass}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
      </label>
      {isShopRole(role) ? null : (
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Fleet account</span>
          <select name="accountId" className={inputClass} aria-invalid={!!errors.accountId}>
            {accounts.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </select>
          {errors.accountId ? <span className="text-sm text-rust-deep">{errors.accountId}</span> : null}
        </label>
      )}
      {role === "approver" ? <Field label="Signing limit ($ per work order)" name="signingLimit" inputMode="decimal" error={errors.signingLimit} /> : null}
      <Field label="First password (they can be told it in person)" name="password" type="password" autoComplete="new-password" error={errors.password} />
      <div className="md:col-span-3">
        <FormMessage result={state} />
        {state?.ok ? <p role="status">Added. They can sign in now.</p> : null}
        <Button type="submit" disabled={pending} className="mt-2">
          Add person
        </Button>
      </div>
    </form>
  );
}
