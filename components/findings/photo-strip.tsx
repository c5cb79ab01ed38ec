"use client";

import { useEffect, useRef, useState } from "react";

export interface PhotoView {
  id: string;
  name: string;
  url: string;
  thumbUrl: string;
  width: number | null;
  height: number | null;
}

const THUMB = { md: { px: 96, className: "size-24" }, sm: { px: 64, className: "size-16" } } as const;

/** Thumbnails in a row; a tap opens the full-size photo over the page, with next and previous. */
export function PhotoStrip({ photos, title, size = "md" }: { photos: readonly PhotoView[]; title: string; size?: keyof typeof THUMB }) {
  const dialog = useRef<HTMLDialogElement>(null);
  // Which photo is open, or null: the full-size image is fetched only when someone asks for it.
  const [open, setOpen] = useState<number | null>(null);
  useEffect(() => {
    if (open !== null && !dialog.current?.open) dialog.current?.showModal();
  }, [open]);
  if (!photos.length) return null;
  const current = open === null ? null : (photos[open] ?? null);
  const step = (by: number) => setOpen((i) => ((i ?? 0) + by + photos.length) % photos.length);
  return (
    <>
      <ul className="flex flex-wrap gap-2" data-testid="photo-strip">
        {photos.map((p, i) => (
          <li key={p.id}>
            <button
              type="button"
              onClick={() => setOpen(i)}
              className="block overflow-hidden rounded-card border-2 border-rule hover:border-ink"
              aria-label={`Photo ${i + 1} of ${photos.length} for “${title}”: open full size`}
            >
              {/* Served by our own scoped route with the session cookie; the image optimiser could not fetch it. */}
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img
                src={p.thumbUrl}
                alt=""
                width={THUMB[size].px}
                height={THUMB[size].px}
                loading="lazy"
                className={`${THUMB[size].className} object-cover`}
                data-testid="photo-thumb"
              />
            </button>
          </li>
        ))}
      </ul>
      <dialog
        ref={dialog}
        className="m-auto max-h-[96dvh] w-[min(96vw,72rem)] rounded-card bg-ink p-0 text-paper backdrop:bg-black/80"
        onClose={() => setOpen(null)}
        onClick={(e) => {
          if (e.target === dialog.current) dialog.current?.close();
        }}
        aria-label={`Photo for “${title}”`}
      >
        {current ? (
          <div className="flex flex-col">
            <div className="flex items-center justify-between gap-2 px-3 py-2 text-sm">
              <span>
                {(open ?? 0) + 1} of {photos.length} · {title}
              </span>
              <button type="button" className="min-h-touch min-w-touch rounded-card border border-paper/40 px-3 font-semibold" onClick={() => dialog.current?.close()}>
                Close
              </button>
            </div>
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img
              src={current.url}
              alt={`Full-size photo ${(open ?? 0) + 1} for “${title}”`}
              width={current.width ?? undefined}
              height={current.height ?? undefined}
              className="max-h-[80dvh] w-full object-contain"
              data-testid="photo-full"
            />
            {photos.length > 1 ? (
              <div className="flex justify-between gap-2 p-2">
                <button type="button" className="min-h-touch flex-1 rounded-card border border-paper/40 font-semibold" onClick={() => step(-1)}>
                  ‹ Previous
                </button>
                <button type="button" className="min-h-touch flex-1 rounded-card border border-paper/40 font-semibold" onClick={() => step(1)}>
                  Next ›
                </button>
              </div>
            ) : null}
          </div>
        ) : null}
      </dialog>
    </>
  );
}
