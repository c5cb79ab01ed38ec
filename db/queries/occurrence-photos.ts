import { and, asc, eq, inArray, isNotNull, isNull, ne } from "drizzle-orm";
import { getDb, type Reader, type Tx } from "@/db/client";
import { photos } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invalidInput } from "@/lib/http/problem";

export interface OccurrencePhotoRef {
  id: string;
}

const photoProblem = (message: string) => invalidInput([{ path: "photoId", message }]);

/**
 * Puts the caller's own new upload on an entry, inside the entry's write. Only
 * a photo this person uploaded for this unit through the occurrence endpoint
 * (no visit, no finding) and not yet on any entry qualifies: the UPDATE's WHERE
 * says so, so two entries racing for one photo cannot both get it.
 */
export async function attachOccurrencePhoto(
  tx: Tx,
  user: SessionUser,
  entry: { id: string; unitId: string; accountId: string },
  photoId: string,
) {
  const [already] = await tx
    .select({ id: photos.id })
    .from(photos)
    .where(and(eq(photos.id, photoId), eq(photos.occurrenceId, entry.id)))
    .limit(1);
  if (already) return;
  const attached = await tx
    .update(photos)
    .set({ occurrenceId: entry.id })
    .where(
      and(
        eq(photos.id, photoId),
        eq(photos.unitId, entry.unitId),
        eq(photos.accountId, entry.accountId),
        eq(photos.uploadedBy, user.id),
        isNull(photos.occurrenceId),
        isNull(photos.findingId),
        isNull(photos.workOrderId),
      ),
    )
    .returning({ id: photos.id });
  if (attached.length) return;
  // Most often a retry after a lost answer: the first send went through with this very photo.
  const [sent] = await tx
    .select({ id: photos.id })
    .from(photos)
    .where(and(eq(photos.id, photoId), eq(photos.uploadedBy, user.id), isNotNull(photos.occurrenceId)))
    .limit(1);
  throw photoProblem(
    sent
      ? "That photo is already on an entry you logged, so this one may have gone through already: check the log. To send it anyway, remove the photo."
      : "That photo cannot go on this entry: it is not a new photo you added for this unit. Take or choose it again.",
  );
}

/** Takes every photo off an entry but `keep`; they go back to being their uploader's unattached uploads. */
export async function detachOccurrencePhotos(tx: Tx, occurrenceId: string, keep: string | null = null) {
  await tx
    .update(photos)
    .set({ occurrenceId: null })
    .where(and(eq(photos.occurrenceId, occurrenceId), keep ? ne(photos.id, keep) : undefined));
}

/** The photo of each entry (the first, should there ever be more), by entry id. */
export async function photosOfOccurrences(occurrenceIds: readonly string[], db: Reader = getDb()): Promise<Map<string, OccurrencePhotoRef>> {
  const byEntry = new Map<string, OccurrencePhotoRef>();
  if (!occurrenceIds.length) return byEntry;
  const rows = await db
    .select({ id: photos.id, occurrenceId: photos.occurrenceId })
    .from(photos)
    .where(inArray(photos.occurrenceId, [...occurrenceIds]))
    .orderBy(asc(photos.createdAt), asc(photos.id));
  for (const r of rows) if (r.occurrenceId && !byEntry.has(r.occurrenceId)) byEntry.set(r.occurrenceId, { id: r.id });
  return byEntry;
}
