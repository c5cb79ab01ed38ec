"use client";

import { inputClass } from "@/components/forms/field";
import { READING_CAUTION, READING_KINDS, tryCheckReading, type ReadingInput, type ReadingKind } from "@/lib/specs";
import { formatReadingValue } from "../reading-list";
import { VerdictMark } from "../verdict-mark";
import { draftToInput, fieldsOf, type ReadingDraft } from "./reading-draft";

const KINDS = Object.keys(READING_KINDS) as ReadingKind[];

/** One reading: what was measured, where, and its fields, with a preview of the verdict. */
function ReadingRow({ draft, index, onChange, onRemove }: { draft: ReadingDraft; index: number; onChange: (d: ReadingDraft) => void; onRemove: () => void }) {
  // A preview only: what is posted is the typed input, and the server works the verdict out again.
  const outcome = tryCheckReading(draftToInput(draft) as unknown as ReadingInput);
  const id = (name: string) => `${draft.key}-${name}`;
  return (
    <li className="flex flex-col gap-3 rounded-card border-2 border-rule-strong bg-paper p-3" data-testid="reading-row">
      <div className="flex items-start justify-between gap-2">
        <p className="font-bold">
          Reading {index + 1}: {READING_KINDS[draft.kind].label}
        </p>
        <button type="button" onClick={onRemove} className="min-h-touch px-2 text-sm font-semibold underline">
          Remove
        </button>
      </div>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Where on the unit</span>
        <input
          className={inputClass}
          value={draft.location}
          maxLength={60}
          placeholder="e.g. Axle 2, right"
          onChange={(e) => onChange({ ...draft, location: e.target.value })}
        />
      </label>
      <div className="grid gap-3 sm:grid-cols-2">
        {fieldsOf(draft.kind).map((f) => (
          <label key={f.name} className="flex flex-col gap-1" htmlFor={id(f.name)}>
            <span className="font-semibold">
              {f.label}
              {f.type === "number" && f.unit ? ` (${f.unit})` : ""}
              {f.optional ? <span className="font-normal text-ink-faint"> · optional</span> : null}
            </span>
            {f.type === "select" ? (
              <select
                id={id(f.name)}
                className={inputClass}
                value={draft.values[f.name] ?? ""}
                onChange={(e) => onChange({ ...draft, values: { ...draft.values, [f.name]: e.target.value } })}
              >
                {f.optional ? <option value="">—</option> : null}
                {f.options.map((o) => (
                  <option key={String(o.value)} value={String(o.value)}>
                    {o.label}
                  </option>
                ))}
              </select>
            ) : (
              <input
                id={id(f.name)}
                className={`${inputClass} figures`}
                type={f.type === "date" ? "date" : "text"}
                inputMode={f.type === "number" ? "decimal" : undefined}
                value={draft.values[f.name] ?? ""}
                onChange={(e) => onChange({ ...draft, values: { ...draft.values, [f.name]: e.target.value } })}
              />
            )}
          </label>
        ))}
      </div>
      {outcome.ok ? (
        <div className="flex flex-col gap-1 rounded-card bg-paper-card px-3 py-2 text-sm" data-testid="reading-preview">
          <p className="flex flex-wrap items-center gap-2">
            <span className="figures font-bold">{formatReadingValue(outcome.result.value, outcome.result.unit)}</span>
            <VerdictMark verdict={outcome.result.verdict} />
          </p>
          <p className="text-ink-soft">Limit: {outcome.result.limit}</p>
          <p className="text-xs text-ink-faint">Source: {outcome.result.source}</p>
          {outcome.result.note ? <p className="text-xs text-ink-soft">{outcome.result.note}</p> : null}
        </div>
      ) : (
        <p className="text-sm text-ink-faint">{outcome.message}</p>
      )}
    </li>
  );
}

/** Readings on a finding: add one by what was measured; each shows its verdict as it is typed. */
export function ReadingEditor({ drafts, onChange, onAdd }: { drafts: ReadingDraft[]; onChange: (next: ReadingDraft[]) => void; onAdd: (kind: ReadingKind) => void }) {
  return (
    <section className="flex flex-col gap-3" aria-labelledby="readings-title">
      <h2 id="readings-title" className="text-lg font-bold">
        Readings <span className="font-normal text-ink-faint">(optional)</span>
      </h2>
      <p role="note" className="border-l-4 border-ink pl-3 text-sm text-ink-soft">
        Measure the way the maker&apos;s procedure says (wheels chocked, engine off where it calls for it). {READING_CAUTION}
      </p>
      {drafts.length ? (
        <ol className="flex flex-col gap-3">
          {drafts.map((d, i) => (
            <ReadingRow
              key={d.key}
              draft={d}
              index={i}
              onChange={(next) => onChange(drafts.map((x) => (x.key === d.key ? next : x)))}
              onRemove={() => onChange(drafts.filter((x) => x.key !== d.key))}
            />
          ))}
        </ol>
      ) : null}
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Add a reading</span>
        <select
          className={inputClass}
          value=""
          data-testid="add-reading"
          onChange={(e) => {
            if (e.target.value) onAdd(e.target.value as ReadingKind);
          }}
        >
          <option value="">Choose what you measured…</option>
          {KINDS.map((k) => (
            <option key={k} value={k}>
              {READING_KINDS[k].label}
            </option>
          ))}
        </select>
      </label>
    </section>
  );
}
