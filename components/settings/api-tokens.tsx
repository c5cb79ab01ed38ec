"use client";

import { useTransition } from "react";
import { Field, FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { createTokenAction, revokeTokenAction } from "@/lib/server/actions/api-tokens";
import { formatDateTime } from "@/lib/format";

export interface TokenRow {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** Personal API tokens for the fleet's own scripts: shown once, stored hashed, revocable. */
export function ApiTokens({ tokens }: { tokens: TokenRow[] }) {
  const [state, create, creating, formRef] = useGuardedForm(createTokenAction);
  const [revoking, startRevoke] = useTransition();
  return (
    <div className="flex flex-col gap-4">
      <form ref={formRef} action={create} className="flex flex-wrap items-end gap-3">
        <Field label="New token name" name="name" placeholder="e.g. nightly fleet export" className="min-w-64 flex-1" error={state && !state.ok ? state.fieldErrors?.name : undefined} />
        <Button type="submit" disabled={creating}>
          Create token
        </Button>
      </form>
      <FormMessage result={state} />
      {state?.ok ? (
        <div role="status" className="rounded-card border-2 border-ink bg-paper p-3" data-testid="new-token">
          <p className="font-semibold">Copy this token now. It will not be shown again.</p>
          <code className="mt-1 block rounded bg-white p-2 text-sm break-all">{state.data.token}</code>
          <p className="mt-1 text-sm text-ink-soft">Send it as <code>Authorization: Bearer …</code>. It acts with your role and your account.</p>
        </div>
      ) : null}
      <ul className="divide-y divide-rule">
        {tokens.map((t) => (
          <li key={t.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <div>
              <p className="font-semibold">
                {t.name} <code className="text-sm text-ink-faint">{t.prefix}…</code>
              </p>
              <p className="text-sm text-ink-faint">
                Created {formatDateTime(t.createdAt)} · {t.lastUsedAt ? `last used ${formatDateTime(t.lastUsedAt)}` : "never used"}
                {t.revokedAt ? ` · revoked ${formatDateTime(t.revokedAt)}` : ""}
              </p>
            </div>
            {t.revokedAt ? null : (
              <Button type="button" variant="danger" disabled={revoking} onClick={() => startRevoke(async () => void (await revokeTokenAction({ tokenId: t.id })))}>
                Revoke
              </Button>
            )}
          </li>
        ))}
        {tokens.length === 0 ? <li className="py-2 text-sm text-ink-faint">No tokens yet.</li> : null}
      </ul>
    </div>
  );
}
