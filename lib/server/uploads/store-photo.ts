import "server-only";
import { UTFile } from "uploadthing/server";
import { insertPhoto } from "@/db/queries/photos";
import { readUpTo } from "@/lib/server/http/read-body";
import { photoUrls } from "@/lib/uploads/photo-urls";
import { CleanPhoto, UnreadablePhotoError, cleanPhoto } from "@/lib/uploads/clean-photo";
import { jpegHasGps } from "@/lib/uploads/exif-gps";
import { ACCEPTED_WORDS, PHOTO_MAX_BYTES, sniffPhotoKind } from "@/lib/uploads/photo-rules";
import { sweepNowAndThen } from "./sweep-photos";
import { utApi } from "./ut-api";

/** What the upload route's middleware vouched for; it travels with the file through the upload service. */
export type PhotoUploadMeta = {
  userId: string;
  accountId: string;
  unitId: string;
  /** Null for an occurrence's photo: it belongs to the unit, not to a visit. */
  workOrderId: string | null;
};

export type PhotoUploadResult =
  | { ok: true; photoId: string; name: string; url: string; thumbUrl: string; width: number; height: number }
  | { ok: false; name: string; error: string };

interface UploadedFile {
  key: string;
  name: string;
  size: number;
}

/**
 * Runs when the upload service says a file has arrived: the stored bytes are
 * checked for what they really are, re-encoded without metadata, stored as a
 * clean full-size copy and thumbnail, and the original (which may carry GPS)
 * is deleted. Never throws: the SDK would then never answer the upload, and
 * the phone would wait; a refusal comes back to the phone as data.
 */
export async function storeUploadedPhoto(meta: PhotoUploadMeta, file: UploadedFile): Promise<PhotoUploadResult> {
  const name = file.name;
  try {
    const original = await readStored(file.key);
    if (!original) return { ok: false, name, error: `${name} is larger than 8 MB and was not kept.` };
    const kind = sniffPhotoKind(original);
    if (!kind) return { ok: false, name, error: `${name} is not a ${ACCEPTED_WORDS} photo, whatever its name says. It was not kept.` };
    let clean: CleanPhoto;
    try {
      clean = await cleanPhoto(original, kind);
    } catch (error) {
      if (!(error instanceof UnreadablePhotoError)) throw error;
      console.warn(`photo ${file.key}: ${error.message}`);
      return { ok: false, name, error: `${name} could not be read as a photo. It was not kept.` };
    }
    // Belt and braces: the clean copy is what customers see.
    if (jpegHasGps(clean.full) || jpegHasGps(clean.thumb)) throw new Error("clean photo still carries GPS data");
    const base = name.replace(/\.[^.]*$/, "").replace(/[^\w.-]+/g, "-").slice(0, 60) || "photo";
    const [full, thumb] = await storeClean(clean, base);
    const photoId = await insertPhoto({
      ...meta,
      uploadedBy: meta.userId,
      fileKey: full.key,
      fileUrl: full.ufsUrl,
      thumbKey: thumb.key,
      thumbUrl: thumb.ufsUrl,
      name,
      sizeBytes: clean.full.length,
      width: clean.width,
      height: clean.height,
    });
    sweepNowAndThen();
    return { ok: true, photoId, name, ...photoUrls(photoId), width: clean.width, height: clean.height };
  } catch (error) {
    console.error(`photo ${file.key} could not be processed`, error);
    return { ok: false, name, error: `${name} could not be saved. Try again.` };
  } finally {
    await utApi()
      .deleteFiles(file.key)
      .catch((error: unknown) => console.error(`original ${file.key} was not deleted`, error));
  }
}

/** The uploaded bytes, or null when there are more than a photo may have. */
async function readStored(key: string): Promise<Uint8Array | null> {
  const { ufsUrl } = await utApi().generateSignedURL(key, { expiresIn: 120 });
  const res = await fetch(ufsUrl, { signal: AbortSignal.timeout(30_000) });
  if (!res.ok || !res.body) throw new Error(`fetching the upload answered ${res.status}`);
  return readUpTo(res.body, PHOTO_MAX_BYTES);
}

async function storeClean(clean: CleanPhoto, base: string): Promise<[{ key: string; ufsUrl: string }, { key: string; ufsUrl: string }]> {
  const results = await utApi().uploadFiles([
    new UTFile([new Uint8Array(clean.full)], `${base}.jpg`, { type: "image/jpeg" }),
    new UTFile([new Uint8Array(clean.thumb)], `${base}-thumb.jpg`, { type: "image/jpeg" }),
  ]);
  const stored = results.map((r) => r.data).filter((d) => d !== null);
  const [full, thumb] = stored;
  if (results.length !== 2 || !full || !thumb) {
    await utApi().deleteFiles(stored.map((d) => d.key)).catch(() => undefined);
    throw new Error(`storing the clean copies failed: ${results.map((r) => r.error?.message ?? "ok").join("; ")}`);
  }
  return [full, thumb];
}
