/**
 * Does a JPEG carry a GPS block? Reads the EXIF APP1 segment (JPEG markers per
 * ITU-T T.81; EXIF 2.32, CIPA DC-008: a TIFF header, then IFD0, whose tag 0x8825
 * points at the GPS IFD). Used after cleaning as a last check that no location
 * leaves the building, and by tests. Pure.
 */
const GPS_IFD_POINTER = 0x8825;

export function jpegHasGps(bytes: Uint8Array): boolean {
  return exifSegments(bytes).some(tiffHasGpsPointer);
}

/** Every APP1 "Exif\0\0" payload (the TIFF structure) before the image data starts. */
function exifSegments(bytes: Uint8Array): Uint8Array[] {
  const found: Uint8Array[] = [];
  if (bytes[0] !== 0xff || bytes[1] !== 0xd8) return found;
  let at = 2;
  while (at + 4 <= bytes.length) {
    if (bytes[at] !== 0xff) break;
    const marker = bytes[at + 1] ?? 0;
    // Start of scan or end of image: no more metadata segments.
    if (marker === 0xda || marker === 0xd9) break;
    const length = ((bytes[at + 2] ?? 0) << 8) | (bytes[at + 3] ?? 0);
    const body = bytes.subarray(at + 4, at + 2 + length);
    const header = String.fromCharCode(...body.subarray(0, 6));
    if (marker === 0xe1 && header === "Exif\0\0") found.push(body.subarray(6));
    at += 2 + length;
  }
  return found;
}

function tiffHasGpsPointer(tiff: Uint8Array): boolean {
  if (tiff.length < 8) return false;
  const little = tiff[0] === 0x49 && tiff[1] === 0x49; // "II"
  const u16 = (o: number) => (little ? (tiff[o] ?? 0) | ((tiff[o + 1] ?? 0) << 8) : ((tiff[o] ?? 0) << 8) | (tiff[o + 1] ?? 0));
  const u32 = (o: number) => (little ? u16(o) + u16(o + 2) * 65536 : u16(o) * 65536 + u16(o + 2));
  const ifd0 = u32(4);
  if (ifd0 + 2 > tiff.length) return false;
  const count = u16(ifd0);
  for (let i = 0; i < count; i += 1) {
    const entry = ifd0 + 2 + i * 12;
    if (entry + 12 > tiff.length) return false;
    if (u16(entry) === GPS_IFD_POINTER) return true;
  }
  return false;
}
