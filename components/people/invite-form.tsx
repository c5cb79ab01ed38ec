"use client";

import { useState } from "react";
import { Field, FormMessage, SelectField } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { inviteAction } from "@/lib/server/actions/people";
import { FLEET_ROLES, ROLE_LABELS, ROLES, isShopRole, type Role } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";

/**
 * Invites a person by e-mail; they choose their own password from the link.
 * With `accountId` set (an account's page) only fleet roles are offered.
 */
export function InviteForm({ accounts, accountId, roles }: { accounts?: { id: string; name: string }[]; accountId?: string; roles?: readonly Role[] }) {
  const offered = roles ?? (accountId ? FLEET_ROLES : ROLES);
  const [state, action, pending, formRef] = useGuardedForm(inviteAction);
  // Most invitations are for a writer, a technician or a fleet's approver; the owner role is a deliberate choice.
  const [role, setRole] = useState<Role>(offered.includes("writer") ? "writer" : (offered[0] ?? "approver"));
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <form ref={formRef} action={action} className="grid gap-3 md:grid-cols-2" data-testid="invite-form">
      <Field label="Name" name="name" autoComplete="off" error={errors.name} />
      <Field label="E-mail" name="email" type="email" autoComplete="off" error={errors.email} />
      <SelectField label="Role" name="role" value={role} onChange={(e) => setRole(e.target.value as Role)} options={offered.map((r) => [r, ROLE_LABELS[r]] as const)} error={errors.role} />
      {isShopRole(role) ? null : accountId ? (
        <input type="hidden" name="accountId" value={accountId} />
      ) : (
        <SelectField label="Fleet account" name="accountId" options={(accounts ?? []).map((a) => [a.id, a.name] as const)} error={errors.accountId} />
      )}
      {role === "approver" ? (
        <Field label="Signing limit ($ per work order)" name="signingLimit" inputMode="decimal" error={errors.signingLimit} hint="The most this person may approve on one work order." />
      ) : null}
      <div className="md:col-span-2">
        <FormMessage result={state} />
        {state?.ok ? (
          <p role="status" className="font-semibold">
            Invitation sent to {state.data.email}. The link works once, until {formatDateTime(state.data.expiresAt)}.
          </p>
        ) : null}
        <Button type="submit" disabled={pending} className="mt-2">
          {pending ? "Sending…" : "Send invitation"}
        </Button>
      </div>
    </form>
  );
}
