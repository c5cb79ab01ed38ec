"use client";

import { useTransition } from "react";
import { retryMailAction } from "@/lib/server/actions/mail";

export function RetryMailButton({ id }: { id: string }) {
  const [pending, start] = useTransition();
  return (
    <button
      type="button"
      disabled={pending}
      onClick={() => start(async () => void (await retryMailAction({ id })))}
      className="min-h-touch rounded-card border border-rule-strong px-3 text-sm font-semibold hover:bg-paper-deep"
    >
      {pending ? "Queuing…" : "Send again"}
    </button>
  );
}
