"use client";

import { FormMessage } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { LINE_STATE_LABELS, type LineState } from "@/lib/domain";
import { markLinesDoneAction } from "@/lib/server/actions/invoices";

/** Approved work not marked done is not billed; the shop can close it here if it is finished. */
export function MarkDoneForm({ workOrderId, lines }: { workOrderId: string; lines: { id: string; description: string; state: LineState }[] }) {
  const [state, formAction, pending, formRef] = useGuardedForm(markLinesDoneAction);
  return (
    <form ref={formRef} action={formAction} className="flex flex-col gap-2 rounded-card border-2 border-rust bg-rust-wash p-3" data-testid="not-done">
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <p className="font-semibold text-rust-deep">
        {lines.length === 1 ? "One approved line is" : `${lines.length} approved lines are`} not marked done and will not be on the invoice:
      </p>
      <ul className="flex flex-col gap-1">
        {lines.map((l) => (
          <li key={l.id}>
            <label className="flex min-h-touch items-center gap-2">
              <input type="checkbox" name="lineIds" value={l.id} className="size-5 accent-rust" />
              <span>
                {l.description} <span className="text-sm text-ink-faint">({LINE_STATE_LABELS[l.state]})</span>
              </span>
            </label>
          </li>
        ))}
      </ul>
      <FormMessage result={state} />
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Saving…" : "Mark ticked lines done"}
        </Button>
      </div>
    </form>
  );
}
