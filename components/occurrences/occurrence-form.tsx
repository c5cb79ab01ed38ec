"use client";

import { useEffect, useRef, useState, useSyncExternalStore } from "react";
import { useNow } from "@/components/data/use-now";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { formatDateTime } from "@/lib/format";
import {
  draftFieldOf,
  draftHasContent,
  draftToBody,
  emptyDraft,
  restoreDraft,
  toggleSign,
  toLocalInput,
  type DraftField,
  type OccurrenceDraft,
} from "@/lib/occurrences/draft";
import { SYMPTOMS, SYMPTOM_LABELS } from "@/lib/occurrences/symptoms";
import { Chips, Question, TypedNumber } from "./form-parts";
import { OccurrencePhotoField } from "./occurrence-photo-field";
import { UnitToggle } from "./unit-toggle";
import { useTemperatureUnit } from "./use-temperature-unit";

export interface OpenConcern {
  id: string;
  complaint: string;
  recordHint: string;
}

type Status =
  | { kind: "idle" }
  | { kind: "sending" }
  | { kind: "sent"; at: string }
  | { kind: "invalid" }
  | { kind: "failed"; message: string };

const PARK_CHIPS = [
  { value: "2", label: "2 h" },
  { value: "8", label: "8 h" },
  { value: "12", label: "Overnight, 12 h" },
  { value: "60", label: "Weekend, 60 h" },
] as const;

const noop = () => () => {};

function draftKey(unitId: string) {
  return `cotter:occurrence-draft:${unitId}`;
}

function loadDraft(unitId: string, fallback: OccurrenceDraft): { draft: OccurrenceDraft; savedAt: number } | null {
  try {
    const raw = window.localStorage.getItem(draftKey(unitId));
    if (!raw) return null;
    const kept = JSON.parse(raw) as { draft: Partial<OccurrenceDraft>; savedAt: number };
    return { draft: restoreDraft(kept.draft, fallback), savedAt: kept.savedAt };
  } catch {
    return null;
  }
}

/** The phone form. Rendered after mount: the draft kept on this phone is read before the first paint. */
export function OccurrenceForm(props: { unitId: string; concerns: OpenConcern[]; onLogged?: () => void }) {
  const mounted = useSyncExternalStore(noop, () => true, () => false);
  if (!mounted) return <p className="text-ink-faint">Loading the form…</p>;
  return <OccurrenceFormInner {...props} />;
}

function OccurrenceFormInner({ unitId, concerns, onLogged }: { unitId: string; concerns: OpenConcern[]; onLogged?: () => void }) {
  const [preferredUnit, setPreferredUnit] = useTemperatureUnit();
  const fresh = () => emptyDraft(concerns.length === 1 ? concerns[0]!.id : null, preferredUnit);
  const [restored] = useState(() => {
    const kept = loadDraft(unitId, fresh());
    return kept && draftHasContent(kept.draft) ? kept : null;
  });
  const [draft, setDraft] = useState<OccurrenceDraft>(() => restored?.draft ?? fresh());
  const [showRestored, setShowRestored] = useState(restored !== null);
  const [errors, setErrors] = useState<Partial<Record<DraftField, string>>>({});
  const [status, setStatus] = useState<Status>({ kind: "idle" });
  const [photoBusy, setPhotoBusy] = useState(false);
  const temperatureInput = useRef<HTMLInputElement>(null);

  // Every keystroke is kept on the phone, so a lost signal or a closed tab loses nothing.
  useEffect(() => {
    try {
      if (draftHasContent(draft)) window.localStorage.setItem(draftKey(unitId), JSON.stringify({ draft, savedAt: Date.now() }));
      else window.localStorage.removeItem(draftKey(unitId));
    } catch {
      // storage full or private mode: the form still holds the values
    }
  }, [draft, unitId]);

  const set = <K extends keyof OccurrenceDraft>(key: K, value: OccurrenceDraft[K]) => {
    setDraft((d) => ({ ...d, [key]: value }));
    const field = key === "when" ? "when" : (key as DraftField);
    setErrors((e) => (e[field] ? { ...e, [field]: undefined } : e));
  };

  async function send() {
    if (photoBusy) return;
    const attemptAt = Date.now();
    const parsed = draftToBody(draft, attemptAt);
    if (!parsed.ok) {
      setErrors(parsed.errors);
      setStatus({ kind: "invalid" });
      return;
    }
    setStatus({ kind: "sending" });
    // If this attempt fails, a later retry must still say when it happened, not when it was sent.
    const keepTime = () => setDraft((d) => (d.when === "now" ? { ...d, when: toLocalInput(attemptAt) } : d));
    try {
      const res = await fetch(`/api/v1/units/${unitId}/occurrences`, {
        method: "POST",
        headers: { "content-type": "application/json", accept: "application/json" },
        body: JSON.stringify(parsed.body),
      });
      if (res.ok) {
        window.localStorage.removeItem(draftKey(unitId));
        setDraft({ ...fresh(), unit: draft.unit, concernId: draft.concernId });
        setErrors({});
        setShowRestored(false);
        setStatus({ kind: "sent", at: parsed.body.occurredAt });
        onLogged?.();
        return;
      }
      const problem = (await res.json().catch(() => ({}))) as { detail?: string; errors?: { path: string; message: string }[] };
      keepTime();
      if (res.status === 400 && problem.errors?.length) {
        const next: Partial<Record<DraftField, string>> = {};
        for (const e of problem.errors) {
          const field = draftFieldOf(e.path);
          if (field) next[field] ??= e.message;
        }
        setErrors(next);
        setStatus({ kind: "invalid" });
      } else if (res.status === 401) {
        setStatus({ kind: "failed", message: "Not sent: you have been signed out. Sign in again; what you entered is kept on this phone." });
      } else {
        setStatus({ kind: "failed", message: `Not sent: the server answered “${problem.detail ?? res.statusText}”. What you entered is kept on this phone; press Send again.` });
      }
    } catch {
      keepTime();
      setStatus({ kind: "failed", message: "Not sent: no connection. Everything you entered is kept on this phone. Press Send again when you have signal." });
    }
  }

  // After ±, the keypad opens on the temperature with the caret after the sign, ready for the digits.
  function flipSign() {
    const next = toggleSign(draft.temperature);
    set("temperature", next);
    const el = temperatureInput.current;
    if (!el) return;
    el.focus();
    requestAnimationFrame(() => el.setSelectionRange(next.length, next.length));
  }

  const concern = concerns.find((c) => c.id === draft.concernId) ?? null;
  const now = useNow(30_000);
  const sending = status.kind === "sending";
  return (
    <form
      className="flex flex-col gap-5"
      data-testid="occurrence-form"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void send();
      }}
    >
      {showRestored && restored ? (
        <div role="status" className="flex flex-wrap items-center justify-between gap-2 rounded-card border-2 border-ink bg-paper-deep p-3" data-testid="draft-restored">
          <span>Kept from before: the entry you started {formatDateTime(new Date(restored.savedAt).toISOString())}. It has not been sent yet.</span>
          <Button type="button" variant="quiet" onClick={() => { setDraft(fresh()); setShowRestored(false); setStatus({ kind: "idle" }); }}>
            Start over
          </Button>
        </div>
      ) : null}

      {concerns.length > 1 ? (
        <Question id="concernId" label="Which problem?" error={errors.concernId}>
          <Chips label="Which problem?" options={concerns.map((c) => ({ value: c.id, label: c.complaint }))} value={draft.concernId ?? ""} onChange={(v) => set("concernId", v || null)} columns={2} />
        </Question>
      ) : null}
      {concern?.recordHint ? (
        <p className="rounded-card bg-paper-deep p-3">
          <span className="block text-sm font-semibold text-ink-faint">What the shop asks you to record</span>
          {concern.recordHint}
        </p>
      ) : null}

      <Question id="when" label="When did it happen?" error={errors.when}>
        <Chips
          label="When"
          options={[{ value: "now", label: "Just now" }, { value: "earlier", label: "Earlier…" }]}
          value={draft.when === "now" ? "now" : "earlier"}
          onChange={(v) => set("when", v === "earlier" ? toLocalInput(Date.now()) : "now")}
        />
        {draft.when !== "now" ? (
          <input type="datetime-local" aria-label="Date and time it happened" className={inputClass} value={draft.when} max={toLocalInput(now + 60_000)} onChange={(e) => set("when", e.target.value || "now")} />
        ) : null}
      </Question>

      <Question id="symptom" label="What did it do?" error={errors.symptom ?? errors.symptomText}>
        <Chips label="What did it do?" options={SYMPTOMS.map((s) => ({ value: s, label: SYMPTOM_LABELS[s] }))} value={draft.symptom} onChange={(v) => set("symptom", v)} />
        {draft.symptom === "other" ? (
          <input aria-label="What did it do, in a few words" className={inputClass} maxLength={200} value={draft.symptomText} onChange={(e) => set("symptomText", e.target.value)} placeholder="In a few words" />
        ) : null}
      </Question>

      <Question id="hoursParked" label="How long had it been parked?" error={errors.hoursParked}>
        <TypedNumber aria-label="Hours parked" unit="hours" value={draft.hoursParked} onChange={(e) => set("hoursParked", e.target.value)} error={errors.hoursParked} placeholder="e.g. 14" />
        <Chips label="Quick picks for hours parked" options={PARK_CHIPS} value={(PARK_CHIPS.find((c) => c.value === draft.hoursParked)?.value ?? "") as (typeof PARK_CHIPS)[number]["value"] | ""} onChange={(v) => set("hoursParked", v)} columns={4} />
      </Question>

      <Question id="temperature" label="Outside temperature" error={errors.temperature}>
        <span className="flex flex-wrap items-center gap-2">
          <Button type="button" variant="secondary" aria-label="Below zero: switch the minus sign" className="min-w-touch text-xl" onClick={flipSign}>
            ±
          </Button>
          <TypedNumber ref={temperatureInput} aria-label={`Outside temperature, °${draft.unit}`} value={draft.temperature} onChange={(e) => set("temperature", e.target.value)} error={errors.temperature} placeholder="e.g. 18" />
          <UnitToggle unit={draft.unit} onChange={(u) => { set("unit", u); setPreferredUnit(u); }} />
        </span>
      </Question>

      <Question id="batteryVolts" label="Battery voltage, if you measured it" hint="Before cranking, with the key off." error={errors.batteryVolts}>
        <TypedNumber aria-label="Battery voltage" unit="V" value={draft.batteryVolts} onChange={(e) => set("batteryVolts", e.target.value)} error={errors.batteryVolts} placeholder="e.g. 12.4" />
      </Question>

      <Question id="recovered" label="Did it come right by itself?">
        <Chips label="Did it come right by itself?" options={[{ value: "yes", label: "Yes" }, { value: "no", label: "No" }]} value={draft.recovered} onChange={(v) => set("recovered", v)} allowClear />
      </Question>

      <Question id="note" label="Anything else (optional)" error={errors.note}>
        <textarea aria-label="Anything else" rows={2} maxLength={1000} className={`${inputClass} py-2`} value={draft.note} onChange={(e) => set("note", e.target.value)} placeholder="What you tried, who saw it" />
      </Question>

      <Question id="photo" label="A photo (optional)" error={errors.photo}>
        <OccurrencePhotoField unitId={unitId} photo={draft.photo} onChange={(p) => set("photo", p)} onBusyChange={setPhotoBusy} />
      </Question>

      {/* Status and Send stay in reach of a thumb at the foot of the screen. */}
      <div className="sticky bottom-0 -mx-4 flex flex-col gap-2 border-t border-rule bg-paper-card/95 px-4 pt-2 pb-3">
        <div aria-live="polite" className="flex flex-col gap-2">
          {status.kind === "failed" ? (
            <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 font-semibold text-rust-deep" data-testid="send-failed">
              {status.message}
            </p>
          ) : null}
          {status.kind === "invalid" ? (
            <p role="alert" className="font-semibold text-rust-deep">Not sent: check the marked answers.</p>
          ) : null}
          {status.kind === "sent" ? (
            <p role="status" className="rounded-card border-2 border-ink bg-paper-card px-3 py-2 font-semibold" data-testid="send-ok">
              Logged for {formatDateTime(status.at)}. The shop has been told. Thank you.
            </p>
          ) : null}
        </div>
        <Button type="submit" disabled={sending || photoBusy} className="min-h-14 w-full text-lg">
          {sending ? "Sending…" : photoBusy ? "Waiting for the photo…" : "Send to the shop"}
        </Button>
      </div>
    </form>
  );
}
