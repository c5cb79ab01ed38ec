"use client";

import Link from "next/link";
import { useState } from "react";
import { inputClass } from "@/components/forms/field";
import { OccurrencePhotoField } from "@/components/occurrences/occurrence-photo-field";
import { Button } from "@/components/ui/button";
import type { DraftPhoto } from "@/lib/occurrences/draft";
import { DEFECT_AREAS } from "@/lib/service-requests";

interface DefectDraft {
  area: string;
  description: string;
  outOfService: boolean;
}

const blank: DefectDraft = { area: "", description: "", outOfService: false };

/**
 * A defect report from the phone, shaped like a driver's vehicle inspection
 * report (49 CFR 396.11): the unit, each defect (and whether it puts the unit
 * out of service), the odometer, and who reports it (the person signed in).
 */
export function DefectReportForm({ units, initialUnitId, reporter }: { units: { id: string; unitNumber: string; description: string }[]; initialUnitId: string; reporter: string }) {
  const [unitId, setUnitId] = useState(initialUnitId);
  const [defects, setDefects] = useState<DefectDraft[]>([blank]);
  const [odometer, setOdometer] = useState("");
  const [note, setNote] = useState("");
  const [photo, setPhoto] = useState<DraftPhoto | null>(null);
  const [photoBusy, setPhotoBusy] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ kind: "idle" | "sending" | "sent" | "failed"; message?: string }>({ kind: "idle" });
  const set = (i: number, patch: Partial<DefectDraft>) => setDefects(defects.map((d, j) => (j === i ? { ...d, ...patch } : d)));

  async function send(event: React.FormEvent) {
    event.preventDefault();
    if (!unitId) {
      setErrors({ unitId: "Choose the unit." });
      return;
    }
    setStatus({ kind: "sending" });
    const res = await fetch(`/api/v1/units/${unitId}/service-requests`, {
      method: "POST",
      headers: { "content-type": "application/json", accept: "application/json" },
      body: JSON.stringify({ defects, odometer: odometer || undefined, note, photoId: photo?.photoId }),
    }).catch(() => null);
    if (!res) return setStatus({ kind: "failed", message: "Not sent: no connection. What you wrote is still here; press Send again." });
    if (res.ok) return setStatus({ kind: "sent" });
    const problem = (await res.json().catch(() => ({}))) as { detail?: string; errors?: { path: string; message: string }[] };
    setErrors(Object.fromEntries((problem.errors ?? []).map((e) => [e.path, e.message])));
    setStatus({ kind: "failed", message: problem.detail ?? res.statusText });
  }

  if (status.kind === "sent") {
    const unit = units.find((u) => u.id === unitId);
    return (
      <div role="status" className="flex flex-col gap-3" data-testid="report-sent">
        <p className="text-lg font-bold">Reported. The shop has your report on {unit?.unitNumber}.</p>
        <p>You will see it marked checked in when the unit is in the shop, then fixed.</p>
        <p>
          <Link href="/fleet/reports">See your reports</Link>
        </p>
      </div>
    );
  }

  return (
    <form onSubmit={send} className="flex flex-col gap-4" noValidate data-testid="defect-report-form">
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Unit</span>
        <select value={unitId} onChange={(e) => setUnitId(e.target.value)} className={inputClass} aria-invalid={errors.unitId ? true : undefined}>
          <option value="">Choose…</option>
          {units.map((u) => (
            <option key={u.id} value={u.id}>
              {u.unitNumber} · {u.description}
            </option>
          ))}
        </select>
        {errors.unitId ? <span className="text-sm font-semibold text-rust-deep">{errors.unitId}</span> : null}
      </label>
      {defects.map((d, i) => (
        <fieldset key={i} className="flex flex-col gap-2 rounded-card border border-rule bg-paper p-3">
          <legend className="px-1 font-bold">Defect {i + 1}</legend>
          <label className="flex flex-col gap-1">
            <span className="text-sm font-semibold">Where on the unit</span>
            <select value={d.area} onChange={(e) => set(i, { area: e.target.value })} className={inputClass}>
              <option value="">Choose, or leave</option>
              {DEFECT_AREAS.map((a) => (
                <option key={a} value={a}>
                  {a}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1">
            <span className="text-sm font-semibold">What is wrong</span>
            <textarea
              value={d.description}
              onChange={(e) => set(i, { description: e.target.value })}
              rows={3}
              className={`${inputClass} py-2`}
              aria-invalid={errors[`defects.${i}.description`] ? true : undefined}
            />
            {errors[`defects.${i}.description`] ? <span className="text-sm font-semibold text-rust-deep">{errors[`defects.${i}.description`]}</span> : null}
          </label>
          <label className="flex min-h-touch items-center gap-3">
            <input type="checkbox" checked={d.outOfService} onChange={(e) => set(i, { outOfService: e.target.checked })} className="size-6 accent-rust" />
            <span>
              <span className="font-semibold">Out of service</span>
              <span className="block text-sm text-ink-soft">Not safe to drive until it is fixed.</span>
            </span>
          </label>
          {defects.length > 1 ? (
            <Button type="button" variant="quiet" onClick={() => setDefects(defects.filter((_, j) => j !== i))}>
              Remove this defect
            </Button>
          ) : null}
        </fieldset>
      ))}
      <Button type="button" variant="secondary" onClick={() => setDefects([...defects, blank])}>
        + Another defect
      </Button>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Odometer (mi), if you can read it</span>
        <input value={odometer} onChange={(e) => setOdometer(e.target.value)} inputMode="numeric" className={inputClass} aria-invalid={errors.odometer ? true : undefined} />
        {errors.odometer ? <span className="text-sm font-semibold text-rust-deep">{errors.odometer}</span> : null}
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Anything else the shop should know</span>
        <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={2} placeholder="Where the unit is parked, when it happened" className={`${inputClass} py-2`} />
      </label>
      {unitId ? <OccurrencePhotoField unitId={unitId} photo={photo} onChange={setPhoto} onBusyChange={setPhotoBusy} /> : null}
      <p className="text-sm text-ink-soft">Reported by {reporter}, now.</p>
      {status.kind === "failed" ? (
        <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
          {status.message}
        </p>
      ) : null}
      <Button type="submit" disabled={status.kind === "sending" || photoBusy}>
        {status.kind === "sending" ? "Sending…" : "Send the report"}
      </Button>
    </form>
  );
}
