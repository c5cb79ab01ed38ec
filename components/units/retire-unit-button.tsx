"use client";

import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { retireUnitAction } from "@/lib/actions/units";

/** A retired unit keeps its history and leaves every list; its number is free for a replacement. */
export function RetireUnitButton({ unitId, retired }: { unitId: string; retired: boolean }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <div>
      <Button
        type="button"
        variant={retired ? "secondary" : "danger"}
        disabled={pending}
        onClick={() =>
          start(async () => {
            const result = await retireUnitAction({ unitId, retired: !retired });
            if (!result.ok) setError(result.error);
          })
        }
      >
        {retired ? "Put the unit back in service" : "Retire this unit"}
      </Button>
      {error ? <p className="text-sm font-semibold text-rust-deep">{error}</p> : null}
    </div>
  );
}
