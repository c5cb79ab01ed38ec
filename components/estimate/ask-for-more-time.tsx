"use client";

import { useRouter } from "next/navigation";
import { useId, useState, useTransition } from "react";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { askForMoreTimeAction } from "@/lib/server/actions/time-clock";

/** The writer's one step: ask the customer for more diagnosis hours (a line that goes to the approver). */
export function AskForMoreTime({ lineId, workOrderId }: { lineId: string; workOrderId: string }) {
  const router = useRouter();
  const id = useId();
  const [hours, setHours] = useState("1.0");
  const [note, setNote] = useState("");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <form
      className="mt-2 flex flex-col gap-2 rounded-card border border-rule-strong bg-paper-card p-2"
      data-testid="ask-for-more-time"
      data-work-order={workOrderId}
      onSubmit={(e) => {
        e.preventDefault();
        start(async () => {
          const r = await askForMoreTimeAction({ lineId, hours, note });
          setMessage(r.ok ? { ok: true, text: "Sent to the customer's approvers." } : { ok: false, text: r.fieldErrors?.hours ?? r.error });
          router.refresh();
        });
      }}
    >
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-sm font-semibold" htmlFor={`${id}-hours`}>
          More hours (tenths)
          <input id={`${id}-hours`} className={`${inputClass} figures w-24`} inputMode="decimal" value={hours} onChange={(e) => setHours(e.target.value)} />
        </label>
        <label className="flex min-w-40 flex-1 flex-col gap-1 text-sm font-semibold" htmlFor={`${id}-note`}>
          Why (the customer reads this)
          <input id={`${id}-note`} className={inputClass} maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
        </label>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Asking…" : "Ask the customer for more time"}
        </Button>
      </div>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`text-sm font-semibold ${message.ok ? "" : "text-rust-deep"}`}>
          {message.text}
        </p>
      ) : null}
    </form>
  );
}
