"use client";

import { useState } from "react";
import { inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { PersonActiveButton } from "@/components/settings/person-active-button";
import { updatePersonAction } from "@/lib/server/actions/people";
import { FLEET_ROLES, ROLE_LABELS, SHOP_ROLES, isShopRole, type Role } from "@/lib/domain";

export interface PersonRowData {
  id: string;
  name: string;
  email: string;
  role: Role;
  accountName: string | null;
  signingLimit: string;
  active: boolean;
  lastSeen: string;
}

/** One person, editable by the owner: name, role on the same side, signing limit, sign-in on or off. */
export function PersonRow({ person, isSelf, shopName }: { person: PersonRowData; isSelf: boolean; shopName: string }) {
  const [state, action, pending, formRef] = useGuardedForm(updatePersonAction);
  const [role, setRole] = useState<Role>(person.role);
  const roles = isShopRole(person.role) ? SHOP_ROLES : FLEET_ROLES;
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <li className="flex flex-col gap-2 py-3" data-testid="person-row">
      <p className="text-sm text-ink-faint">
        {person.email} · {person.accountName ?? shopName} · {person.lastSeen}
        {person.active ? "" : " · sign-in turned off"}
      </p>
      <form ref={formRef} action={action} className="flex flex-wrap items-end gap-3">
        <input type="hidden" name="userId" value={person.id} />
        <label className="flex min-w-48 flex-1 flex-col gap-1">
          <span className="text-sm font-semibold">Name</span>
          <input name="name" defaultValue={person.name} className={inputClass} aria-invalid={errors.name ? true : undefined} />
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">Role</span>
          {isSelf ? <input type="hidden" name="role" value={person.role} /> : null}
          <select name={isSelf ? undefined : "role"} value={role} disabled={isSelf} onChange={(e) => setRole(e.target.value as Role)} className={inputClass}>
            {roles.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </label>
        {role === "approver" ? (
          <label className="flex flex-col gap-1">
            <span className="text-sm font-semibold">Signing limit ($)</span>
            <input name="signingLimit" defaultValue={person.signingLimit} inputMode="decimal" className={`${inputClass} figures w-36`} />
          </label>
        ) : null}
        <Button type="submit" variant="secondary" disabled={pending}>
          Save
        </Button>
        {isSelf ? null : <PersonActiveButton userId={person.id} active={person.active} />}
      </form>
      {state && !state.ok ? <p className="text-sm font-semibold text-rust-deep">{state.error} {Object.values(state.fieldErrors ?? {}).join(" ")}</p> : null}
      {state?.ok ? <p className="text-sm" role="status">{state.data.changed ? "Saved." : "Nothing changed."}</p> : null}
    </li>
  );
}
