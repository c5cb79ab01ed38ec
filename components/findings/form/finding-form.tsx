"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/data/fetcher";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import type { Severity } from "@/lib/domain";
import type { ReadingKind } from "@/lib/specs";
import { LineProposals, type LineDraft } from "./line-proposals";
import { PhotoPicker, type UploadedPhoto } from "./photo-picker";
import { draftToInput, newReadingDraft, type ReadingDraft } from "./reading-draft";
import { ReadingEditor } from "./reading-editor";
import { SeverityChoice } from "./severity-choice";

interface ConcernOption {
  id: string;
  complaint: string;
}

type Problem = { detail: string; errors: { path: string; message: string }[] };

/** The technician's finding, phone first: photos, severity, title, note, readings, proposed lines, post. */
export function FindingForm({ workOrderId, concerns }: { workOrderId: string; concerns: ConcernOption[] }) {
  const router = useRouter();
  const [title, setTitle] = useState("");
  const [severity, setSeverity] = useState<Severity | null>(null);
  const [concernId, setConcernId] = useState("");
  const [note, setNote] = useState("");
  const [photos, setPhotos] = useState<UploadedPhoto[]>([]);
  const [readings, setReadings] = useState<ReadingDraft[]>([]);
  const [lines, setLines] = useState<LineDraft[]>([]);
  const [problem, setProblem] = useState<Problem | null>(null);
  const [posting, setPosting] = useState(false);

  async function post(event: React.FormEvent) {
    event.preventDefault();
    const missing = [!title.trim() ? "Give the finding a short title." : null, !severity ? "Choose how serious it is." : null].filter(
      (m): m is string => m !== null,
    );
    if (missing.length) {
      setProblem({ detail: "Some values are missing.", errors: missing.map((message) => ({ path: "", message })) });
      return;
    }
    setPosting(true);
    setProblem(null);
    try {
      await fetchJson(`/api/v1/work-orders/${workOrderId}/findings`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({
          title,
          severity,
          noteMarkdown: note,
          concernId: concernId || null,
          photoIds: photos.map((p) => p.photoId),
          readings: readings.map(draftToInput),
          proposedLines: lines.map((l) => ({ description: l.description, kind: l.kind, quantity: Number(l.quantity.replace(",", ".")) })),
        }),
      });
      router.push(`/work-orders/${workOrderId}#findings`);
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError) {
        const body = (error.body ?? {}) as { errors?: { path: string; message: string }[] };
        setProblem({ detail: error.message, errors: body.errors ?? [] });
      } else {
        setProblem({ detail: "Could not reach the server. Your finding is still here; try again.", errors: [] });
      }
      setPosting(false);
    }
  }

  return (
    <form onSubmit={post} className="flex flex-col gap-6" data-testid="finding-form" noValidate>
      <section className="flex flex-col gap-2" aria-labelledby="photos-title">
        <h2 id="photos-title" className="text-lg font-bold">
          Photos
        </h2>
        <PhotoPicker workOrderId={workOrderId} photos={photos} onChange={setPhotos} />
      </section>

      <SeverityChoice value={severity} onChange={setSeverity} />

      <label className="flex flex-col gap-1">
        <span className="font-semibold">What did you find?</span>
        <input
          name="title"
          className={`${inputClass} text-lg`}
          value={title}
          maxLength={120}
          placeholder="e.g. Right rear brake stroke past the limit"
          onChange={(e) => setTitle(e.target.value)}
        />
      </label>

      {concerns.length ? (
        <label className="flex flex-col gap-1">
          <span className="font-semibold">For which concern? <span className="font-normal text-ink-faint">(optional)</span></span>
          <select className={inputClass} value={concernId} onChange={(e) => setConcernId(e.target.value)} name="concernId">
            <option value="">Not tied to a concern</option>
            {concerns.map((c, i) => (
              <option key={c.id} value={c.id}>
                {i + 1}. {c.complaint}
              </option>
            ))}
          </select>
        </label>
      ) : null}

      <label className="flex flex-col gap-1">
        <span className="font-semibold">Note <span className="font-normal text-ink-faint">(optional)</span></span>
        <textarea
          name="noteMarkdown"
          className={`${inputClass} min-h-28 py-2`}
          value={note}
          maxLength={4000}
          onChange={(e) => setNote(e.target.value)}
          placeholder="What you saw, what you measured, what it means for the customer."
        />
        <span className="text-sm text-ink-faint">Short is best. **bold** and lines starting with “- ” make a list.</span>
      </label>

      <ReadingEditor drafts={readings} onChange={setReadings} onAdd={(kind: ReadingKind) => setReadings([...readings, newReadingDraft(kind)])} />

      <LineProposals lines={lines} onChange={setLines} suggestion={title.trim()} />

      {problem ? (
        <div role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep" data-testid="form-problem">
          <p>{problem.detail}</p>
          {problem.errors.length ? (
            <ul className="mt-1 list-disc pl-5">
              {problem.errors.map((e) => (
                <li key={`${e.path}:${e.message}`}>{e.message}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      <div className="sticky bottom-0 -mx-3 border-t border-rule bg-paper/95 px-3 py-3 sm:static sm:mx-0 sm:border-0 sm:bg-transparent sm:px-0">
        <Button type="submit" disabled={posting} className="w-full text-lg">
          {posting ? "Posting…" : "Post finding"}
        </Button>
      </div>
    </form>
  );
}
