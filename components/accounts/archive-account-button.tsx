"use client";

import { ToggleActionButton } from "@/components/ui/toggle-action-button";
import { archiveAccountAction } from "@/lib/server/actions/accounts";

/** Archiving keeps the account's history and takes it off every list; it can be brought back. */
export function ArchiveAccountButton({ accountId, archived }: { accountId: string; archived: boolean }) {
  return <ToggleActionButton on={archived} labels={{ turnOn: "Archive this account", turnOff: "Bring the account back" }} run={(next) => archiveAccountAction({ accountId, archived: next })} />;
}
