import { createUploadthing, type FileRouter } from "uploadthing/server";
import { z } from "zod";
import { authorisePhotoUpload } from "@/lib/uploads/authorise-upload";
import { PHOTO_MAX_SIZE_LABEL, PHOTOS_PER_FINDING } from "@/lib/uploads/photo-rules";
import { storeUploadedPhoto } from "@/lib/uploads/store-photo";

const f = createUploadthing();

/** Photos for a technician's finding, several at a time from the phone's camera. */
export const photoRouter = {
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
} satisfies FileRouter;

export type PhotoRouter = typeof photoRouter;
