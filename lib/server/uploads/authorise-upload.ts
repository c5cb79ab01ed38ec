import "server-only";
import { UploadThingError } from "uploadthing/server";
import { findScopedUnit } from "@/db/queries/occurrences";
import { workOrderForUpload } from "@/db/queries/photos";
import { CAN, hasRole } from "@/lib/auth/policy";
import { userFromRequest } from "@/lib/server/auth/resolve-user";
import { OCCURRENCE_PHOTOS, refusalsFor, type FileFacts } from "@/lib/uploads/photo-rules";
import type { PhotoUploadMeta } from "./store-photo";

const signedOut = () => new UploadThingError({ code: "FORBIDDEN", message: "Your session has ended. Sign in again to add photos." });

/**
 * The upload route's middleware: the same checks as every other write (who,
 * which role, which work order in their scope), plus the photo rules, before
 * the upload service is asked to take a single byte.
 */
export async function authorisePhotoUpload(
  request: Request,
  input: { workOrderId: string; attached: number },
  files: readonly FileFacts[],
): Promise<PhotoUploadMeta> {
  const user = await userFromRequest(request);
  if (!user) throw signedOut();
  if (!hasRole(user, CAN.postFindings)) throw new UploadThingError({ code: "FORBIDDEN", message: "Your role may not add photos to findings." });
  const wo = await workOrderForUpload(user, input.workOrderId);
  if (!wo) throw new UploadThingError({ code: "NOT_FOUND", message: "That work order was not found." });
  if (wo.status === "released") {
    throw new UploadThingError({ code: "BAD_REQUEST", message: "This visit is closed; photos can no longer be added." });
  }
  const refusals = refusalsFor(files, input.attached);
  if (refusals.length) throw new UploadThingError({ code: "BAD_REQUEST", message: refusals.join(" ") });
  return { userId: user.id, accountId: wo.accountId, unitId: wo.unitId, workOrderId: wo.id };
}

/**
 * The same for a photo on an occurrence-log entry: anyone who may log one on
 * this unit (its account's people, the shop). The photo belongs to no visit and
 * stays unattached, seen by nobody in the fleet, until the entry is posted with it.
 */
export async function authoriseOccurrencePhotoUpload(
  request: Request,
  input: { unitId: string },
  files: readonly FileFacts[],
): Promise<PhotoUploadMeta> {
  const user = await userFromRequest(request);
  if (!user) throw signedOut();
  if (!hasRole(user, CAN.logOccurrence)) throw new UploadThingError({ code: "FORBIDDEN", message: "Your role may not log occurrences." });
  const unit = await findScopedUnit(user, input.unitId);
  if (!unit) throw new UploadThingError({ code: "NOT_FOUND", message: "That unit was not found." });
  const refusals = refusalsFor(files, 0, OCCURRENCE_PHOTOS);
  if (refusals.length) throw new UploadThingError({ code: "BAD_REQUEST", message: refusals.join(" ") });
  return { userId: user.id, accountId: unit.accountId, unitId: unit.id, workOrderId: null };
}
