"use client";

import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { resendInvitationAction, withdrawInvitationAction } from "@/lib/server/actions/people";
import { ROLE_LABELS, type Role } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";

export interface PendingInvitation {
  id: string;
  name: string;
  email: string;
  role: Role;
  accountName: string | null;
  expiresAt: string;
  sentAt: string;
}

/** Invitations not yet accepted: re-send (a new link, a new week) or withdraw. */
export function PendingInvitations({ rows, now }: { rows: PendingInvitation[]; now: string }) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  if (!rows.length) return <p className="text-ink-faint">No invitations waiting.</p>;
  const run = (fn: () => Promise<{ ok: boolean; error?: string }>, done: string) =>
    start(async () => {
      const result = await fn();
      setMessage(result.ok ? done : (result.error ?? "That did not work."));
    });
  return (
    <div>
      <ul className="divide-y divide-rule" data-testid="pending-invitations">
        {rows.map((i) => {
          const expired = i.expiresAt <= now;
          return (
            <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <div>
                <p className="font-semibold">
                  {i.name} <span className="text-sm font-normal text-ink-faint">· {ROLE_LABELS[i.role]}{i.accountName ? ` · ${i.accountName}` : ""}</span>
                </p>
                <p className="text-sm text-ink-faint">
                  {i.email} · sent {formatDateTime(i.sentAt)} · {expired ? <strong className="text-rust-deep">expired</strong> : `link good until ${formatDateTime(i.expiresAt)}`}
                </p>
              </div>
              <div className="flex gap-2">
                <Button type="button" variant="secondary" disabled={pending} onClick={() => run(() => resendInvitationAction({ invitationId: i.id }), `Sent ${i.email} a new link.`)}>
                  Re-send
                </Button>
                <Button type="button" variant="danger" disabled={pending} onClick={() => run(() => withdrawInvitationAction({ invitationId: i.id }), `Withdrew the invitation to ${i.email}.`)}>
                  Withdraw
                </Button>
              </div>
            </li>
          );
        })}
      </ul>
      {message ? (
        <p role="status" className="mt-2 font-semibold">
          {message}
        </p>
      ) : null}
    </div>
  );
}
