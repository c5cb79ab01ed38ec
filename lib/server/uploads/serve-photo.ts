import "server-only";
import { findPhotoFile } from "@/db/queries/photos";
import type { SessionUser } from "@/lib/auth/session-user";
import { HttpError, notFound } from "@/lib/http/problem";
import { sniffPhotoKind } from "@/lib/uploads/photo-rules";
import { utApi } from "./ut-api";

/**
 * A photo's bytes, passed through from the upload service to someone allowed
 * to see it. The service's own URL never reaches the browser, so access is
 * decided here every time (another account's photo is a 404, like any id).
 */
export async function photoResponse(user: SessionUser, photoId: string, size: "full" | "thumb"): Promise<Response> {
  const photo = await findPhotoFile(user, photoId);
  if (!photo) throw notFound("That photo");
  const key = size === "thumb" ? (photo.thumbKey ?? photo.fileKey) : photo.fileKey;
  let upstream: Response;
  try {
    const { ufsUrl } = await utApi().generateSignedURL(key, { expiresIn: 60 });
    upstream = await fetch(ufsUrl, { signal: AbortSignal.timeout(15_000) });
  } catch (error) {
    console.error(`photo ${photoId}: upload service unreachable`, error);
    throw unavailable();
  }
  if (upstream.status === 404) throw notFound("That photo's file");
  if (!upstream.ok || !upstream.body) throw unavailable();
  // The type comes from the bytes themselves, not from what storage or the row claims.
  const bytes = new Uint8Array(await upstream.arrayBuffer());
  const kind = sniffPhotoKind(bytes);
  if (kind !== "jpeg" && kind !== "png" && kind !== "webp") {
    console.error(`photo ${photoId}: stored file is not a servable image`);
    throw unavailable();
  }
  return new Response(bytes, {
    headers: {
      "content-type": `image/${kind}`,
      "content-disposition": `inline; filename="${size === "thumb" ? "thumb-" : ""}${photo.id}.${kind === "jpeg" ? "jpg" : kind}"`,
      // A photo id always names the same clean bytes; only this browser may keep them.
      "cache-control": "private, max-age=3600",
      "x-content-type-options": "nosniff",
    },
  });
}

const unavailable = () =>
  new HttpError(502, "upload_service_unavailable", "Photo storage unavailable", "The photo could not be fetched from storage. Try again shortly.");
