"use client";

import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { LINE_KIND_LABELS, LINE_KINDS, type LineKind } from "@/lib/domain";

export interface LineDraft {
  key: string;
  description: string;
  kind: LineKind;
  quantity: string;
}

/** Estimate lines the finding proposes; the service writer prices them in the estimate editor. */
export function LineProposals({ lines, onChange, suggestion }: { lines: LineDraft[]; onChange: (next: LineDraft[]) => void; suggestion: string }) {
  const update = (key: string, patch: Partial<LineDraft>) => onChange(lines.map((l) => (l.key === key ? { ...l, ...patch } : l)));
  return (
    <section className="flex flex-col gap-3" aria-labelledby="lines-title">
      <h2 id="lines-title" className="text-lg font-bold">
        Propose estimate lines <span className="font-normal text-ink-faint">(optional)</span>
      </h2>
      {lines.map((l, i) => (
        <div key={l.key} className="flex flex-col gap-2 rounded-card border-2 border-rule-strong bg-paper p-3" data-testid="line-row">
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Line {i + 1}</span>
            <input className={inputClass} value={l.description} maxLength={200} onChange={(e) => update(l.key, { description: e.target.value })} />
          </label>
          <div className="grid grid-cols-[1fr_7rem_auto] items-end gap-2">
            <label className="flex flex-col gap-1">
              <span className="text-sm font-semibold">Kind</span>
              <select className={inputClass} value={l.kind} onChange={(e) => update(l.key, { kind: e.target.value as LineKind, quantity: l.quantity })}>
                {LINE_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {LINE_KIND_LABELS[k]}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1">
              <span className="text-sm font-semibold">{l.kind === "labor" ? "Hours" : "Quantity"}</span>
              <input className={`${inputClass} figures`} inputMode="decimal" value={l.quantity} onChange={(e) => update(l.key, { quantity: e.target.value })} />
            </label>
            <button type="button" className="min-h-touch px-2 text-sm font-semibold underline" onClick={() => onChange(lines.filter((x) => x.key !== l.key))}>
              Remove
            </button>
          </div>
        </div>
      ))}
      <Button
        type="button"
        variant="secondary"
        onClick={() =>
          onChange([...lines, { key: `line-${Date.now()}-${lines.length}`, description: suggestion, kind: lines.length === 0 ? "labor" : "part", quantity: "1.0" }])
        }
      >
        + Propose a line
      </Button>
      {lines.length ? <p className="text-sm text-ink-faint">They go to the service writer&apos;s estimate as drafts; the customer sees them once priced and sent.</p> : null}
    </section>
  );
}
