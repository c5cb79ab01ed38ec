import { and, asc, inArray, isNull, lt } from "drizzle-orm";
import { writeTx } from "@/db/client";
import { photos } from "@/db/schema";

export interface SweptPhoto {
  id: string;
  fileKey: string;
  thumbKey: string | null;
}

/**
 * Removes, oldest first, photos uploaded before `cutoffIso` that never made it
 * onto a finding, an occurrence or a defect report (a form left unsent, a finding deleted), and
 * returns their stored keys so the caller can delete the files.
 */
export async function takeUnattachedPhotos(cutoffIso: string, limit: number): Promise<SweptPhoto[]> {
  return writeTx(async (tx) => {
    const rows = await tx
      .select({ id: photos.id, fileKey: photos.fileKey, thumbKey: photos.thumbKey })
      .from(photos)
      .where(and(isNull(photos.findingId), isNull(photos.occurrenceId), isNull(photos.serviceRequestId), lt(photos.createdAt, cutoffIso)))
      .orderBy(asc(photos.createdAt))
      .limit(limit);
    const ids = rows.map((r) => r.id);
    if (ids.length > 0) await tx.delete(photos).where(inArray(photos.id, ids));
    return rows;
  });
}
