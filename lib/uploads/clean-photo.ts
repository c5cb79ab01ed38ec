import convertHeic from "heic-convert";
import sharp from "sharp";
import type { PhotoKind } from "./photo-rules";

/** Long edge of the full-size copy: plenty to see a cracked weld on a phone or a desk screen. */
export const FULL_EDGE_PX = 2048;
export const THUMB_EDGE_PX = 320;
// A phone camera makes about 12–50 megapixels; far beyond that is not a photo but a decompression bomb.
const MAX_INPUT_PIXELS = 120_000_000;

export interface CleanPhoto {
  full: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
}

export class UnreadablePhotoError extends Error {}

/**
 * Re-encodes a photo as plain JPEG: turned upright by its orientation tag, then
 * written with NO metadata at all (sharp drops EXIF, GPS, XMP and IPTC unless
 * asked to keep them), so a customer never receives where the photo was taken.
 */
export async function cleanPhoto(bytes: Uint8Array, kind: PhotoKind): Promise<CleanPhoto> {
  let input: Uint8Array = bytes;
  if (kind === "heic") {
    // The bundled libvips reads only AV1-coded HEIF; phone HEIC is HEVC-coded, decoded here.
    try {
      input = await convertHeic({ buffer: bytes, format: "JPEG", quality: 0.95 });
    } catch (error) {
      throw new UnreadablePhotoError(`HEIC decode failed: ${error instanceof Error ? error.message : String(error)}`);
    }
  }
  try {
    const upright = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: "error" }).rotate();
    const { data: full, info } = await upright
      .clone()
      .resize({ width: FULL_EDGE_PX, height: FULL_EDGE_PX, fit: "inside", withoutEnlargement: true })
      .flatten({ background: "#ffffff" })
      .jpeg({ quality: 82, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    const thumb = await upright
      .clone()
      .resize({ width: THUMB_EDGE_PX, height: THUMB_EDGE_PX, fit: "cover", position: "centre" })
      .flatten({ background: "#ffffff" })
      .jpeg({ quality: 75, mozjpeg: true })
      .toBuffer();
    return { full, thumb, width: info.width, height: info.height };
  } catch (error) {
    throw new UnreadablePhotoError(`Image decode failed: ${error instanceof Error ? error.message : String(error)}`);
  }
}
