"use client";

import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/server/auth/guarded-action";
import { Button } from "./button";

/** One button that turns a state on or off through a guarded action (archive an account, retire a unit). */
export function ToggleActionButton({ on, labels, run }: { on: boolean; labels: { turnOn: string; turnOff: string }; run: (next: boolean) => Promise<ActionResult<unknown>> }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <div>
      <Button
        type="button"
        variant={on ? "secondary" : "danger"}
        disabled={pending}
        onClick={() =>
          start(async () => {
            const result = await run(!on);
            setError(result.ok ? null : result.error);
          })
        }
      >
        {on ? labels.turnOff : labels.turnOn}
      </Button>
      {error ? <p className="text-sm font-semibold text-rust-deep">{error}</p> : null}
    </div>
  );
}
