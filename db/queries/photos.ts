import { and, eq, isNotNull, or } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { occurrences, photos, workOrders } from "@/db/schema";
import { isStaff } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";
import { scopedTo } from "./scope";

/** The work order a photo is being uploaded to, scoped; null when it does not exist for this user. */
export async function workOrderForUpload(user: SessionUser, workOrderId: string) {
  const [row] = await getDb()
    .select({ id: workOrders.id, accountId: workOrders.accountId, unitId: workOrders.unitId, status: workOrders.status })
    .from(workOrders)
    .where(and(eq(workOrders.id, workOrderId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  return row ?? null;
}

export interface NewPhoto {
  accountId: string;
  unitId: string;
  workOrderId: string | null;
  uploadedBy: string;
  fileKey: string;
  fileUrl: string;
  thumbKey: string;
  thumbUrl: string;
  name: string;
  sizeBytes: number;
  width: number;
  height: number;
}

export async function insertPhoto(photo: NewPhoto): Promise<string> {
  return writeTx(async (tx) => {
    const [row] = await tx
      .insert(photos)
      .values({ ...photo, mime: "image/jpeg" })
      .returning({ id: photos.id });
    if (!row) throw new Error("photo insert returned nothing");
    return row.id;
  });
}

/**
 * A photo's stored keys, if this user may see it: shop staff see every photo;
 * fleet people see only their own account's photos that are on a posted
 * finding or on an entry in their account's occurrence log, and their own
 * uploads; never someone else's upload that is not posted yet.
 */
export async function findPhotoFile(user: SessionUser, photoId: string) {
  const [row] = await getDb()
    .select({ id: photos.id, fileKey: photos.fileKey, thumbKey: photos.thumbKey, mime: photos.mime, name: photos.name })
    .from(photos)
    .leftJoin(occurrences, eq(occurrences.id, photos.occurrenceId))
    .where(
      and(
        eq(photos.id, photoId),
        scopedTo(photos.accountId, user),
        isStaff(user)
          ? undefined
          : // Their own new upload too, so the phone can show what it just sent before the entry is.
            or(isNotNull(photos.findingId), scopedTo(occurrences.accountId, user), eq(photos.uploadedBy, user.id)),
      ),
    )
    .limit(1);
  return row ?? null;
}
