"use client";

import { FormMessage, inputClass } from "@/components/forms/field";
import { useGuardedForm } from "@/components/forms/use-guarded-form";
import { Button } from "@/components/ui/button";
import { addConcernAction, concernAction } from "@/lib/server/actions/visits";
import type { ConcernView } from "@/components/work-order/concern-list";

/** One concern's three Cs: the complaint as written at check-in, and cause and correction as the work goes. */
function ConcernRow({ concern, n }: { concern: ConcernView; n: number }) {
  const [state, action, pending, formRef] = useGuardedForm(concernAction);
  return (
    <li className="rounded-card border border-rule bg-paper p-3" data-testid="concern">
      <p className="font-bold">
        {n}. {concern.complaint}
        {concern.intermittent ? <span className="ml-2 rounded-full border border-ink px-2 py-0.5 text-xs font-semibold">Intermittent</span> : null}
      </p>
      <form ref={formRef} action={action} className="mt-2 flex flex-col gap-2">
        <input type="hidden" name="concernId" value={concern.id} />
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">Cause</span>
          <textarea name="cause" defaultValue={concern.cause} rows={2} placeholder="What was found to be wrong" className={`${inputClass} py-2`} />
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">Correction</span>
          <textarea name="correction" defaultValue={concern.correction} rows={2} placeholder="What was done about it" className={`${inputClass} py-2`} />
        </label>
        <FormMessage result={state} />
        <div className="flex items-center gap-3">
          <Button type="submit" variant="secondary" disabled={pending}>
            {pending ? "Saving…" : "Save cause and correction"}
          </Button>
          {state?.ok ? <span role="status">{state.data.changed ? "Saved." : "Nothing changed."}</span> : null}
        </div>
      </form>
    </li>
  );
}

export function ConcernEditor({ workOrderId, concerns }: { workOrderId: string; concerns: ConcernView[] }) {
  const [state, action, pending, formRef] = useGuardedForm(addConcernAction);
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <div className="flex flex-col gap-3">
      <ol className="flex flex-col gap-3">
        {concerns.map((c, i) => (
          <ConcernRow key={c.id} concern={c} n={i + 1} />
        ))}
      </ol>
      <form ref={formRef} action={action} className="flex flex-col gap-2 border-t border-rule pt-3" data-testid="add-concern">
        <input type="hidden" name="workOrderId" value={workOrderId} />
        <label className="flex flex-col gap-1">
          <span className="font-semibold">A concern found later</span>
          <textarea name="complaint" rows={2} className={`${inputClass} py-2`} aria-invalid={errors.complaint ? true : undefined} />
        </label>
        {errors.complaint ? <span className="text-sm font-semibold text-rust-deep">{errors.complaint}</span> : null}
        <FormMessage result={state} />
        <div>
          <Button type="submit" variant="secondary" disabled={pending}>
            Add the concern
          </Button>
        </div>
      </form>
    </div>
  );
}
