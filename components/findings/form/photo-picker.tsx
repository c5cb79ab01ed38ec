"use client";

import { useRef, useState } from "react";
import { CameraIcon, UploadProblems, UploadProgress, contentRefusal, progressed, type InFlight } from "@/components/photos/upload-parts";
import { buttonClass } from "@/components/ui/button";
import type { PhotoUploadResult } from "@/lib/server/uploads/store-photo";
import { ACCEPTED_WORDS, PHOTO_ACCEPT, PHOTOS_PER_FINDING, refusalFor } from "@/lib/uploads/photo-rules";
import { uploadFiles } from "./upload-client";

export interface UploadedPhoto {
  photoId: string;
  name: string;
  url: string;
  thumbUrl: string;
}

/**
 * Camera or library, several photos at once, each with its own progress bar.
 * Files are checked here first (kind, 8 MB, 8 per finding); the server checks
 * again and has the last word.
 */
export function PhotoPicker({ workOrderId, photos, onChange }: { workOrderId: string; photos: UploadedPhoto[]; onChange: (next: UploadedPhoto[]) => void }) {
  const [inFlight, setInFlight] = useState<InFlight[]>([]);
  const [problems, setProblems] = useState<string[]>([]);
  const latest = useRef(photos);
  latest.current = photos;
  const room = PHOTOS_PER_FINDING - photos.length - inFlight.length;

  async function take(list: FileList | null) {
    const files = Array.from(list ?? []);
    if (!files.length) return;
    const reasons: string[] = [];
    const good: File[] = [];
    for (const file of files) {
      const reason = refusalFor(file) ?? (await contentRefusal(file));
      if (reason) reasons.push(reason);
      else if (good.length < room) good.push(file);
      else reasons.push(`${file.name} was left out: a finding takes at most ${PHOTOS_PER_FINDING} photos.`);
    }
    setProblems(reasons);
    if (!good.length) return;
    const batch: InFlight[] = good.map((f, i) => ({ key: `${Date.now()}-${i}-${f.name}`, name: f.name, phase: "preparing", percent: 0 }));
    setInFlight((now) => [...now, ...batch]);
    const keyOf = new Map(good.map((f, i) => [f, batch[i]?.key ?? ""]));
    try {
      const results = await uploadFiles("findingPhotos", {
        files: good,
        input: { workOrderId, attached: photos.length + inFlight.length },
        onUploadBegin: ({ file }) =>
          setInFlight((now) => now.map((u) => (batch.some((b) => b.key === u.key) && u.name === file && u.phase === "preparing" ? { ...u, phase: "sending" } : u))),
        onUploadProgress: ({ file, progress }) => setInFlight((now) => now.map((u) => (u.key === keyOf.get(file) ? progressed(u, progress) : u))),
      });
      const added: UploadedPhoto[] = [];
      const refused: string[] = [];
      for (const r of results) {
        const data = r.serverData as PhotoUploadResult | null;
        if (data?.ok) added.push({ photoId: data.photoId, name: data.name, url: data.url, thumbUrl: data.thumbUrl });
        else refused.push(data?.error ?? `${r.name} could not be saved. Try again.`);
      }
      onChange([...latest.current, ...added]);
      if (refused.length) setProblems((p) => [...p, ...refused]);
    } catch (error) {
      setProblems((p) => [...p, error instanceof Error ? error.message : "The upload failed. Try again."]);
    } finally {
      setInFlight((now) => now.filter((u) => !batch.some((b) => b.key === u.key)));
    }
  }

  return (
    <div className="flex flex-col gap-3" data-testid="photo-picker">
      <div className="grid grid-cols-2 gap-2">
        <label className={buttonClass("primary", `min-h-16 text-lg ${room <= 0 ? "pointer-events-none opacity-50" : "cursor-pointer"}`)}>
          <CameraIcon /> Take photo
          <input
            type="file"
            accept={PHOTO_ACCEPT}
            capture="environment"
            className="sr-only"
            disabled={room <= 0}
            onChange={(e) => {
              void take(e.currentTarget.files);
              e.currentTarget.value = "";
            }}
          />
        </label>
        <label className={buttonClass("secondary", `min-h-16 text-lg ${room <= 0 ? "pointer-events-none opacity-50" : "cursor-pointer"}`)}>
          Choose photos
          <input
            type="file"
            accept={PHOTO_ACCEPT}
            multiple
            className="sr-only"
            disabled={room <= 0}
            data-testid="photo-input"
            onChange={(e) => {
              void take(e.currentTarget.files);
              e.currentTarget.value = "";
            }}
          />
        </label>
      </div>
      <p className="text-sm text-ink-faint">
        {ACCEPTED_WORDS}, up to 8 MB each, {PHOTOS_PER_FINDING} per finding. Location data is removed before the customer sees them.
      </p>
      <UploadProgress inFlight={inFlight} />
      <UploadProblems problems={problems} />
      {photos.length ? (
        <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4" data-testid="uploaded-photos">
          {photos.map((p) => (
            <li key={p.photoId} className="relative">
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img src={p.thumbUrl} alt={p.name} className="aspect-square w-full rounded-card border border-rule object-cover" />
              <button
                type="button"
                onClick={() => onChange(photos.filter((x) => x.photoId !== p.photoId))}
                className="absolute top-1 right-1 min-h-touch min-w-touch rounded-full bg-ink/80 text-lg font-bold text-paper"
                aria-label={`Leave out ${p.name}`}
              >
                ×
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
