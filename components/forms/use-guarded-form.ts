"use client";

import { useActionState, useEffect, useRef } from "react";
import type { ActionResult } from "@/lib/server/auth/guarded-action";

type Sent<T> = { result: ActionResult<T>; sent: FormData } | null;

/**
 * A form posting to a guarded server action. React clears a form's fields once
 * its action has run; when the server refused the input, the person gets back
 * exactly what they typed, beside the reason, instead of an empty form.
 * Returns [result, formAction, pending, ref]; put `ref` on the <form>.
 */
export function useGuardedForm<T>(action: (form: FormData) => Promise<ActionResult<T>>) {
  const ref = useRef<HTMLFormElement>(null);
  const [state, formAction, pending] = useActionState<Sent<T>, FormData>(async (_prev, form) => ({ result: await action(form), sent: form }), null);
  useEffect(() => {
    if (state && !state.result.ok && ref.current) refill(ref.current, state.sent);
  }, [state]);
  return [state?.result ?? null, formAction, pending, ref] as const;
}

/** Puts submitted values back into the form's fields (hidden and file inputs are left alone). */
function refill(form: HTMLFormElement, sent: FormData): void {
  const seen = new Map<string, number>();
  for (const el of Array.from(form.elements)) {
    if (!(el instanceof HTMLInputElement || el instanceof HTMLSelectElement || el instanceof HTMLTextAreaElement) || !el.name) continue;
    const values = sent.getAll(el.name).filter((v): v is string => typeof v === "string");
    if (el instanceof HTMLInputElement) {
      if (el.type === "hidden" || el.type === "file") continue;
      if (el.type === "checkbox" || el.type === "radio") {
        el.checked = values.includes(el.value);
        continue;
      }
    }
    // Several fields may share a name: give each its own value, in order.
    const index = seen.get(el.name) ?? 0;
    seen.set(el.name, index + 1);
    const value = values[index];
    if (value !== undefined) el.value = value;
  }
}
