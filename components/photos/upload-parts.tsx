"use client";

import { ACCEPTED_WORDS, sniffPhotoKind } from "@/lib/uploads/photo-rules";

/**
 * One file on its way up. Its progress is what is really happening: first the app asks for a
 * place to send it (no bytes move yet), then the bytes go (the share sent, from the browser's own
 * upload events), then the server cleans the photo (location data, thumbnail).
 */
export interface InFlight {
  key: string;
  name: string;
  phase: "preparing" | "sending" | "cleaning";
  percent: number;
}

/** The next state of a file from an SDK progress event (percent of the file's bytes sent). */
export function progressed(u: InFlight, percent: number): InFlight {
  const p = Math.max(u.percent, Math.min(100, Math.round(percent)));
  return { ...u, percent: p, phase: p >= 100 ? "cleaning" : "sending" };
}

/** Reads the first bytes in the browser, so a renamed text file is refused before it is sent. */
export async function contentRefusal(file: File): Promise<string | null> {
  const head = new Uint8Array(await file.slice(0, 64).arrayBuffer());
  return sniffPhotoKind(head) ? null : `${file.name} is not a ${ACCEPTED_WORDS} photo, whatever its name says.`;
}

const PROGRESS_CLASS =
  "h-3 w-full appearance-none overflow-hidden rounded-full border border-ink bg-rule accent-rust [&::-moz-progress-bar]:bg-rust [&::-webkit-progress-bar]:bg-rule [&::-webkit-progress-value]:bg-rust";

const PHASE_WORDS = { preparing: "Getting ready…", cleaning: "Sent. Cleaning the photo…" } as const;

/** A progress bar per file: measured while the bytes go; moving, without a number, while the app prepares or cleans. */
export function UploadProgress({ inFlight }: { inFlight: readonly InFlight[] }) {
  if (!inFlight.length) return null;
  return (
    <ul className="flex flex-col gap-2" aria-live="polite" data-testid="upload-progress">
      {inFlight.map((u) => (
        <li key={u.key} className="text-sm" data-phase={u.phase}>
          <div className="flex justify-between gap-2">
            <span className="truncate">{u.name}</span>
            <span className="figures" data-testid="upload-progress-words">
              {u.phase === "sending" ? `${u.percent} % sent` : PHASE_WORDS[u.phase]}
            </span>
          </div>
          {/* Styled by hand: left to itself Chromium draws the bar green, a colour this app keeps out of its scheme. */}
          {u.phase === "sending" ? (
            <progress className={PROGRESS_CLASS} max={100} value={u.percent} aria-label={`Uploading ${u.name}`} />
          ) : (
            // No value: the bar shows work going on without claiming a share of it.
            <progress className={PROGRESS_CLASS} aria-label={`${PHASE_WORDS[u.phase]} ${u.name}`} />
          )}
        </li>
      ))}
    </ul>
  );
}

export function UploadProblems({ problems }: { problems: readonly string[] }) {
  if (!problems.length) return null;
  return (
    <ul role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep" data-testid="photo-problems">
      {problems.map((p) => (
        <li key={p}>{p}</li>
      ))}
    </ul>
  );
}

export function CameraIcon() {
  return (
    <svg width="24" height="24" viewBox="0 0 24 24" aria-hidden>
      <path d="M4 7h3l2-2.5h6L17 7h3a1 1 0 0 1 1 1v10a1 1 0 0 1-1 1H4a1 1 0 0 1-1-1V8a1 1 0 0 1 1-1z" fill="none" stroke="currentColor" strokeWidth="2" />
      <circle cx="12" cy="12.5" r="3.5" fill="none" stroke="currentColor" strokeWidth="2" />
    </svg>
  );
}
