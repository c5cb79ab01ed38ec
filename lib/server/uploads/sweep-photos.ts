import "server-only";
import { takeUnattachedPhotos } from "@/db/queries/photo-sweep";
import { utApi } from "./ut-api";

/**
 * An unsent form's photos are kept a week: a foreman's occurrence draft may
 * wait out a lost signal for days, and nobody but the uploader can see them.
 */
export const KEEP_UNATTACHED_MS = 7 * 24 * 60 * 60 * 1000;
const BATCH = 100;
const EVERY_MS = 60 * 60 * 1000;

/** Deletes up to one batch of photos no finding or occurrence took, rows and files. Returns how many. */
export async function sweepUnattachedPhotos(now: Date = new Date()): Promise<number> {
  const swept = await takeUnattachedPhotos(new Date(now.getTime() - KEEP_UNATTACHED_MS).toISOString(), BATCH);
  const keys = swept.flatMap((p) => (p.thumbKey ? [p.fileKey, p.thumbKey] : [p.fileKey]));
  if (keys.length > 0) await utApi().deleteFiles(keys);
  return swept.length;
}

const holder = globalThis as unknown as { __cotterLastPhotoSweep?: number };

/**
 * Runs a sweep in the background at most once an hour per server, piggybacking
 * on uploads so no scheduler is needed. Errors are logged, never thrown.
 */
export function sweepNowAndThen(now: number = Date.now()): void {
  if (holder.__cotterLastPhotoSweep !== undefined && now - holder.__cotterLastPhotoSweep < EVERY_MS) return;
  holder.__cotterLastPhotoSweep = now;
  sweepUnattachedPhotos(new Date(now)).catch((error: unknown) => console.error("sweeping unattached photos failed", error));
}
