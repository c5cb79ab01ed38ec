"use client";

import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { archiveAccountAction } from "@/lib/actions/accounts";

/** Archiving keeps the account's history and takes it off every list; it can be brought back. */
export function ArchiveAccountButton({ accountId, archived }: { accountId: string; archived: boolean }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <div>
      <Button
        type="button"
        variant={archived ? "secondary" : "danger"}
        disabled={pending}
        onClick={() =>
          start(async () => {
            const result = await archiveAccountAction({ accountId, archived: !archived });
            if (!result.ok) setError(result.error);
          })
        }
      >
        {archived ? "Bring the account back" : "Archive this account"}
      </Button>
      {error ? <p className="text-sm font-semibold text-rust-deep">{error}</p> : null}
    </div>
  );
}
