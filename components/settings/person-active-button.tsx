"use client";

import { useTransition } from "react";
import { personActiveAction } from "@/lib/server/actions/people";

export function PersonActiveButton({ userId, active }: { userId: string; active: boolean }) {
  const [pending, start] = useTransition();
  return (
    <button
      type="button"
      disabled={pending}
      onClick={() => start(async () => void (await personActiveAction({ userId, active: active ? "false" : "true" })))}
      className="min-h-touch rounded-card border border-rule-strong px-3 text-sm font-semibold hover:bg-paper-deep"
    >
      {active ? "Turn off sign-in" : "Turn sign-in back on"}
    </button>
  );
}
