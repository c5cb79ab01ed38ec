"use client";

import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";

// The server keeps 2048 px on the long edge (lib/uploads/clean-photo.ts); more would only be sent to be thrown away.
const STILL_EDGE_PX = 2048;

/** Whether a chosen file is a video rather than a photo (some phones give no type; then the name says). */
export function isVideoFile(file: Pick<File, "name" | "type">): boolean {
  if (file.type) return file.type.startsWith("video/");
  return /\.(mp4|m4v|mov|webm|3gp|mkv)$/i.test(file.name);
}

/** Resolves once the element has a decoded frame at its current time to draw. */
function frameReady(video: HTMLVideoElement): Promise<void> {
  if (video.readyState >= HTMLMediaElement.HAVE_CURRENT_DATA) return Promise.resolve();
  return new Promise((resolve) => {
    video.addEventListener("seeked", () => resolve(), { once: true });
    video.addEventListener("loadeddata", () => resolve(), { once: true });
    // Some phone browsers decode nothing until asked for a position.
    video.currentTime = Math.max(video.currentTime, 0.001);
  });
}

/**
 * A short video stays on the phone: the person plays or drags to the moment
 * that shows the fault, and only that frame is drawn onto a canvas and sent,
 * as a JPEG photo like any other (a canvas carries no location data).
 */
export function VideoStillPicker({ file, onPick, onCancel }: { file: File; onPick: (still: File) => void; onCancel: () => void }) {
  const video = useRef<HTMLVideoElement>(null);
  const [ready, setReady] = useState(false);
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    const el = video.current;
    if (!el) return;
    const url = URL.createObjectURL(file);
    el.src = url;
    return () => {
      el.removeAttribute("src");
      URL.revokeObjectURL(url);
    };
  }, [file]);

  async function takeStill() {
    const v = video.current;
    if (!v) return;
    v.pause();
    await frameReady(v);
    if (!v.videoWidth || !v.videoHeight) {
      setFailed(true);
      return;
    }
    const scale = Math.min(1, STILL_EDGE_PX / Math.max(v.videoWidth, v.videoHeight));
    const canvas = document.createElement("canvas");
    canvas.width = Math.round(v.videoWidth * scale);
    canvas.height = Math.round(v.videoHeight * scale);
    canvas.getContext("2d")?.drawImage(v, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/jpeg", 0.9));
    if (!blob) {
      setFailed(true);
      return;
    }
    const base = file.name.replace(/\.[^.]*$/, "") || "video";
    onPick(new File([blob], `${base}-still.jpg`, { type: "image/jpeg" }));
  }

  return (
    <div className="flex flex-col gap-2 rounded-card border-2 border-ink bg-paper-deep p-3" data-testid="video-still-picker">
      <p className="text-sm font-semibold">Play or drag to the moment that shows it, then use that moment. Only that one picture is sent.</p>
      <video
        ref={video}
        controls
        muted
        playsInline
        preload="auto"
        aria-label={`Video ${file.name}`}
        className="max-h-[50dvh] w-full rounded-card bg-ink"
        onLoadedMetadata={() => setReady(true)}
        onError={() => setFailed(true)}
      />
      {failed ? (
        <p role="alert" className="text-sm font-semibold text-rust-deep">
          This phone could not open that video. Take a photo instead, or pause the video on another screen and photograph it.
        </p>
      ) : null}
      <div className="grid grid-cols-2 gap-2">
        <Button type="button" disabled={!ready || failed} onClick={() => void takeStill()} className="min-h-12">
          Use this moment
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel} className="min-h-12">
          Cancel
        </Button>
      </div>
    </div>
  );
}
