"use client";

import { useState } from "react";
import { uploadFiles } from "@/components/findings/form/upload-client";
import { PhotoStrip } from "@/components/findings/photo-strip";
import { CameraIcon, UploadProblems, UploadProgress, contentRefusal, progressed, type InFlight } from "@/components/photos/upload-parts";
import { Button, buttonClass } from "@/components/ui/button";
import type { DraftPhoto } from "@/lib/occurrences/draft";
import { ACCEPTED_WORDS, PHOTO_ACCEPT, refusalFor } from "@/lib/uploads/photo-rules";
import type { PhotoUploadResult } from "@/lib/server/uploads/store-photo";
import { VideoStillPicker, isVideoFile } from "./video-still-picker";

const NO_SIGNAL = "No connection: the photo was not sent. The rest of your entry is kept; add the photo again when you have signal, or send without it.";

/**
 * The entry's one optional photo: straight from the camera, or chosen (a photo,
 * or a still picked from a short video). It goes up as soon as it is chosen, so
 * Send only has to name it; the draft keeps the uploaded photo across a reload.
 */
export function OccurrencePhotoField({
  unitId,
  photo,
  onChange,
  onBusyChange,
}: {
  unitId: string;
  photo: DraftPhoto | null;
  onChange: (photo: DraftPhoto | null) => void;
  onBusyChange: (busy: boolean) => void;
}) {
  const [inFlight, setInFlight] = useState<InFlight | null>(null);
  const [problems, setProblems] = useState<string[]>([]);
  const [video, setVideo] = useState<File | null>(null);

  async function send(file: File) {
    onBusyChange(true);
    const reason = refusalFor(file) ?? (await contentRefusal(file));
    if (reason) {
      setProblems([reason]);
      onBusyChange(false);
      return;
    }
    setProblems([]);
    setInFlight({ key: `${Date.now()}-${file.name}`, name: file.name, phase: "preparing", percent: 0 });
    try {
      const [result] = await uploadFiles("occurrencePhoto", {
        files: [file],
        input: { unitId },
        onUploadBegin: () => setInFlight((u) => (u && u.phase === "preparing" ? { ...u, phase: "sending" } : u)),
        onUploadProgress: ({ progress }) => setInFlight((u) => (u ? progressed(u, progress) : u)),
      });
      const data = result?.serverData as PhotoUploadResult | null | undefined;
      if (data?.ok) onChange({ photoId: data.photoId, name: data.name, url: data.url, thumbUrl: data.thumbUrl });
      else setProblems([data?.error ?? `${file.name} could not be saved. Try again.`]);
    } catch (error) {
      const offline = typeof navigator !== "undefined" && !navigator.onLine;
      setProblems([offline || !(error instanceof Error) ? NO_SIGNAL : error.message]);
    } finally {
      setInFlight(null);
      onBusyChange(false);
    }
  }

  function chosen(input: HTMLInputElement) {
    const file = input.files?.[0];
    input.value = "";
    if (!file) return;
    if (isVideoFile(file)) {
      // Send waits while a moment is being picked, so the entry does not go without the photo being chosen.
      setProblems([]);
      setVideo(file);
      onBusyChange(true);
    } else void send(file);
  }

  if (video) {
    return (
      <VideoStillPicker
        file={video}
        onCancel={() => {
          setVideo(null);
          onBusyChange(false);
        }}
        onPick={(still) => {
          setVideo(null);
          void send(still);
        }}
      />
    );
  }

  const busy = inFlight !== null;
  return (
    <div className="flex flex-col gap-3" data-testid="occurrence-photo">
      {photo ? (
        <div className="flex items-center gap-3">
          <PhotoStrip photos={[{ id: photo.photoId, name: photo.name, url: photo.url, thumbUrl: photo.thumbUrl, width: null, height: null }]} title="This entry" />
          <Button type="button" variant="secondary" onClick={() => onChange(null)} aria-label={`Remove the photo ${photo.name}`}>
            Remove photo
          </Button>
        </div>
      ) : (
        <div className="grid grid-cols-2 gap-2">
          <label className={buttonClass("secondary", `min-h-14 ${busy ? "pointer-events-none opacity-50" : "cursor-pointer"}`)}>
            <CameraIcon /> Add a photo
            <input
              type="file"
              accept={PHOTO_ACCEPT}
              capture="environment"
              className="sr-only"
              disabled={busy}
              data-testid="occurrence-photo-camera"
              onChange={(e) => chosen(e.currentTarget)}
            />
          </label>
          <label className={buttonClass("secondary", `min-h-14 text-center leading-tight ${busy ? "pointer-events-none opacity-50" : "cursor-pointer"}`)}>
            Choose a photo or video
            <input
              type="file"
              accept={`${PHOTO_ACCEPT},video/*`}
              className="sr-only"
              disabled={busy}
              data-testid="occurrence-photo-input"
              onChange={(e) => chosen(e.currentTarget)}
            />
          </label>
        </div>
      )}
      {!photo && !busy ? (
        <p className="text-sm text-ink-faint">
          One photo ({ACCEPTED_WORDS}, up to 8 MB), or a still from a short video: only the moment you pick is sent. Location data is removed.
        </p>
      ) : null}
      {inFlight ? <UploadProgress inFlight={[inFlight]} /> : null}
      <UploadProblems problems={problems} />
    </div>
  );
}
