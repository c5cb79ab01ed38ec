/**
 * What a photo (a finding's or an occurrence's) may be, checked the same way
 * on the phone (before anything is sent), in the upload route's middleware
 * (before a URL is signed) and on the stored bytes (the only check that cannot
 * be lied to). Pure.
 */

/** 8 MB as the upload SDK counts it (1 MB = 1024 × 1024 bytes). */
export const PHOTO_MAX_BYTES = 8 * 1024 * 1024;
export const PHOTO_MAX_SIZE_LABEL = "8MB";
export const PHOTOS_PER_FINDING = 8;

export type PhotoKind = "jpeg" | "png" | "webp" | "heic";

const TYPES: Record<string, PhotoKind> = {
  "image/jpeg": "jpeg",
  "image/jpg": "jpeg",
  "image/pjpeg": "jpeg",
  "image/png": "png",
  "image/webp": "webp",
  "image/heic": "heic",
  "image/heif": "heic",
};

const EXTENSIONS: Record<string, PhotoKind> = {
  jpg: "jpeg",
  jpeg: "jpeg",
  png: "png",
  webp: "webp",
  heic: "heic",
  heif: "heic",
};

/** For <input accept>: phones offer the camera and the photo library for these. */
export const PHOTO_ACCEPT = "image/jpeg,image/png,image/webp,image/heic,image/heif,.heic,.heif";

export const ACCEPTED_WORDS = "JPEG, PNG, WebP or HEIC";

export interface FileFacts {
  name: string;
  size: number;
  type: string;
}

/** What the file says it is, by its declared type or else its name; null when it is not a photo we take. */
export function declaredKind(file: Pick<FileFacts, "name" | "type">): PhotoKind | null {
  const type = file.type.trim().toLowerCase();
  if (type) return TYPES[type] ?? null;
  // Some browsers give HEIC files no type at all.
  const ext = /\.([a-z0-9]+)$/i.exec(file.name)?.[1]?.toLowerCase();
  return ext ? (EXTENSIONS[ext] ?? null) : null;
}

export function formatMegabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** The reason one file is refused before upload, or null when it may go. */
export function refusalFor(file: FileFacts): string | null {
  if (!declaredKind(file)) return `${file.name} is not a photo we can take: send ${ACCEPTED_WORDS} only.`;
  if (file.size > PHOTO_MAX_BYTES) {
    return `${file.name} is ${formatMegabytes(file.size)}; a photo may be at most 8 MB.`;
  }
  if (file.size === 0) return `${file.name} is empty.`;
  return null;
}

/** How many photos one thing takes, and how to say there are too many. */
export interface PhotoLimit {
  max: number;
  tooMany: (room: number) => string;
}

export const FINDING_PHOTOS: PhotoLimit = {
  max: PHOTOS_PER_FINDING,
  tooMany: (room) => `A finding takes at most ${PHOTOS_PER_FINDING} photos; there is room for ${room} more.`,
};

/** A driver's entry in the occurrence log: one photo (or a still from a short video) is enough to show the shop. */
export const PHOTOS_PER_OCCURRENCE = 1;
export const OCCURRENCE_PHOTOS: PhotoLimit = {
  max: PHOTOS_PER_OCCURRENCE,
  tooMany: () => "An entry in the occurrence log takes one photo.",
};

/** Every reason a batch is refused: each file's, and too many for what they are attached to. */
export function refusalsFor(files: readonly FileFacts[], alreadyAttached = 0, limit: PhotoLimit = FINDING_PHOTOS): string[] {
  const reasons = files.map(refusalFor).filter((r): r is string => r !== null);
  if (alreadyAttached + files.length > limit.max) reasons.push(limit.tooMany(Math.max(limit.max - alreadyAttached, 0)));
  return reasons;
}

const HEIC_BRANDS = new Set(["heic", "heix", "hevc", "hevx", "heim", "heis", "hevm", "hevs"]);
const HEIF_GENERIC_BRANDS = new Set(["mif1", "msf1"]);

function ascii(bytes: Uint8Array, from: number, to: number): string {
  return String.fromCharCode(...bytes.subarray(from, to));
}

/**
 * What the bytes are, by their signature: JPEG (FF D8 FF), PNG (the 8-byte
 * PNG signature), WebP (RIFF….WEBP), HEIC (an ISO-BMFF "ftyp" box whose brands
 * name HEVC-coded HEIF). A text file renamed .jpg is none of these.
 */
export function sniffPhotoKind(bytes: Uint8Array): PhotoKind | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return "jpeg";
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (bytes.length >= 8 && png.every((b, i) => bytes[i] === b)) return "png";
  if (bytes.length >= 12 && ascii(bytes, 0, 4) === "RIFF" && ascii(bytes, 8, 12) === "WEBP") return "webp";
  if (bytes.length >= 12 && ascii(bytes, 4, 8) === "ftyp") {
    const boxSize = ((bytes[0] ?? 0) << 24) | ((bytes[1] ?? 0) << 16) | ((bytes[2] ?? 0) << 8) | (bytes[3] ?? 0);
    const major = ascii(bytes, 8, 12);
    if (HEIC_BRANDS.has(major)) return "heic";
    if (HEIF_GENERIC_BRANDS.has(major)) {
      // Compatible brands follow the major brand and minor version, four bytes each.
      const end = Math.min(boxSize, bytes.length);
      for (let at = 16; at + 4 <= end; at += 4) if (HEIC_BRANDS.has(ascii(bytes, at, at + 4))) return "heic";
    }
  }
  return null;
}
