import { createUploadthing, type FileRouter } from "uploadthing/server";
import { z } from "zod";
import { authoriseOccurrencePhotoUpload, authorisePhotoUpload } from "@/lib/server/uploads/authorise-upload";
import { PHOTO_MAX_SIZE_LABEL, PHOTOS_PER_FINDING, PHOTOS_PER_OCCURRENCE } from "@/lib/uploads/photo-rules";
import { storeUploadedPhoto } from "@/lib/server/uploads/store-photo";

const f = createUploadthing();

export const photoRouter = {
  /** Photos for a technician's finding, several at a time from the phone's camera. */
  findingPhotos: f({ image: { maxFileSize: PHOTO_MAX_SIZE_LABEL, maxFileCount: PHOTOS_PER_FINDING } })
    .input(
      z.object({
        workOrderId: z.string().min(1).max(64),
        // Photos already on the finding being written, so the eight are counted across batches.
        attached: z.number().int().min(0).max(PHOTOS_PER_FINDING).default(0),
      }),
    )
    .middleware(({ req, input, files }) => authorisePhotoUpload(req, input, files))
    .onUploadComplete(({ metadata, file }) => storeUploadedPhoto(metadata, { key: file.key, name: file.name, size: file.size })),

  /** The one photo a driver or foreman may add to an occurrence-log entry, before it is sent. */
  occurrencePhoto: f({ image: { maxFileSize: PHOTO_MAX_SIZE_LABEL, maxFileCount: PHOTOS_PER_OCCURRENCE } })
    .input(z.object({ unitId: z.string().min(1).max(64) }))
    .middleware(({ req, input, files }) => authoriseOccurrencePhotoUpload(req, input, files))
    .onUploadComplete(({ metadata, file }) => storeUploadedPhoto(metadata, { key: file.key, name: file.name, size: file.size })),
} satisfies FileRouter;

export type PhotoRouter = typeof photoRouter;
