"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { LINE_KIND_LABELS, LINE_KINDS, type LineKind } from "@/lib/domain";
import { addLineAction, editLineAction } from "@/lib/server/actions/estimate";
import { formatCents, lineAmountCents } from "@/lib/money";
import { centsToText, rateIdFor, switchKind, valuesToLine, type LineFormValues, type RateOption } from "./line-values";

export { valuesToLine, type LineFormValues, type RateOption } from "./line-values";

/** Adds or edits one estimate line; shows the line amount as the numbers are typed. */
export function LineForm({
  workOrderId,
  concerns,
  rates,
  taxDefaults,
  initial,
  line,
  onDone,
  onChange,
}: {
  workOrderId: string;
  concerns: { id: string; label: string }[];
  rates: RateOption[];
  taxDefaults: Record<LineKind, boolean>;
  initial: LineFormValues;
  line?: { id: string; version: number };
  onDone: (notice?: string) => void;
  onChange?: (values: LineFormValues) => void;
}) {
  const router = useRouter();
  const [values, setValues] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [pending, start] = useTransition();
  const set = (patch: Partial<LineFormValues>) => {
    const next = { ...values, ...patch };
    setValues(next);
    onChange?.(next);
  };
  const priced = valuesToLine(values);
  const amount = priced.ok ? lineAmountCents(priced.quantityMilli, priced.unitPriceCents) : null;

  function chooseKind(kind: LineKind) {
    const next = switchKind(values, kind, rates, taxDefaults);
    setValues(next);
    onChange?.(next);
  }

  function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const payload = { ...values, concernId: values.concernId || undefined };
    start(async () => {
      const result = line
        ? await editLineAction({ ...payload, lineId: line.id, expectedVersion: line.version })
        : await addLineAction({ ...payload, workOrderId });
      if (!result.ok) {
        setError(result.error);
        setFieldErrors(result.fieldErrors ?? {});
        return;
      }
      setError(null);
      const data = result.data as { outcome?: string; reason?: string | null } | null;
      onDone(data?.outcome === "back_to_proposed" ? `The line went back to the customer for approval: ${data.reason}.` : undefined);
      router.refresh();
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3 rounded-card border-2 border-ink bg-paper-card p-3" data-testid="line-form">
      <fieldset className="flex flex-wrap gap-2">
        <legend className="sr-only">Kind</legend>
        {LINE_KINDS.map((k) => (
          <button
            type="button"
            key={k}
            aria-pressed={values.kind === k}
            onClick={() => chooseKind(k)}
            className={`min-h-touch rounded-card border-2 px-3 font-semibold ${values.kind === k ? "border-ink bg-ink text-paper" : "border-rule-strong bg-white"}`}
          >
            {LINE_KIND_LABELS[k]}
          </button>
        ))}
      </fieldset>
      <div className="grid gap-3 md:grid-cols-[2fr_1fr]">
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">Description</span>
          <input className={inputClass} value={values.description} onChange={(e) => set({ description: e.target.value })} required aria-invalid={!!fieldErrors.description} />
          {fieldErrors.description ? <span className="text-sm text-rust-deep">{fieldErrors.description}</span> : null}
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">Concern</span>
          <select className={inputClass} value={values.concernId} onChange={(e) => set({ concernId: e.target.value })}>
            <option value="">Not tied to a concern</option>
            {concerns.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label}
              </option>
            ))}
          </select>
        </label>
      </div>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">{values.kind === "labor" ? "Hours (tenths)" : "Quantity"}</span>
          <input className={`${inputClass} figures`} inputMode="decimal" value={values.quantity} onChange={(e) => set({ quantity: e.target.value })} aria-invalid={!!fieldErrors.quantity} />
          {fieldErrors.quantity || (!priced.ok && priced.problem?.startsWith("Labour")) ? (
            <span className="text-sm text-rust-deep" data-testid="quantity-problem">
              {fieldErrors.quantity ?? (!priced.ok ? priced.problem : null)}
            </span>
          ) : null}
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-sm font-semibold">{values.kind === "labor" ? "Rate ($/h)" : "Unit price ($)"}</span>
          <input className={`${inputClass} figures`} inputMode="decimal" value={values.unitPrice} onChange={(e) => set({ unitPrice: e.target.value })} aria-invalid={!!fieldErrors.unitPrice} />
          {fieldErrors.unitPrice ? <span className="text-sm text-rust-deep">{fieldErrors.unitPrice}</span> : null}
        </label>
        {values.kind === "labor" ? (
          <label className="flex flex-col gap-1">
            <span className="text-sm font-semibold">Labour rate</span>
            <select
              className={inputClass}
              value={rateIdFor(values.unitPrice, rates)}
              onChange={(e) => {
                const rate = rates.find((r) => r.id === e.target.value);
                if (rate) set({ unitPrice: centsToText(rate.rateCents) });
              }}
            >
              <option value="">{rateIdFor(values.unitPrice, rates) ? "Pick a rate…" : "Another rate (typed)"}</option>
              {rates.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.name} · {formatCents(r.rateCents)}
                </option>
              ))}
            </select>
          </label>
        ) : null}
        {values.kind === "part" ? (
          <>
            <label className="flex flex-col gap-1">
              <span className="text-sm font-semibold">Part number</span>
              <input className={inputClass} value={values.partNumber} onChange={(e) => set({ partNumber: e.target.value })} />
            </label>
            <label className="flex flex-col gap-1">
              <span className="text-sm font-semibold">Core charge ($ each)</span>
              <input className={`${inputClass} figures`} inputMode="decimal" value={values.coreCharge} onChange={(e) => set({ coreCharge: e.target.value })} />
            </label>
          </>
        ) : null}
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <label className="flex min-h-touch items-center gap-2">
          <input type="checkbox" className="size-5 accent-rust" checked={values.taxable} onChange={(e) => set({ taxable: e.target.checked })} />
          Taxable
        </label>
        {values.kind === "labor" ? (
          <label className="flex min-h-touch items-center gap-2">
            <input type="checkbox" className="size-5 accent-rust" checked={values.isDiagnosis} onChange={(e) => set({ isDiagnosis: e.target.checked })} />
            Diagnosis (time box)
          </label>
        ) : null}
        <span className="ml-auto text-sm">
          Line amount: <strong className="figures text-base" data-testid="line-amount">{amount === null ? "—" : formatCents(amount)}</strong>
        </span>
      </div>
      {error ? (
        <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
          {error}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : line ? "Save line" : "Add line"}
        </Button>
        <Button type="button" variant="quiet" onClick={() => onDone()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
