import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { jpegHasGps } from "@/lib/uploads/exif-gps";
import { OCCURRENCE_PHOTOS, PHOTO_MAX_BYTES, declaredKind, refusalFor, refusalsFor, sniffPhotoKind } from "@/lib/uploads/photo-rules";

const bytes = (...values: (number | string)[]) =>
  Uint8Array.from(values.flatMap((v) => (typeof v === "string" ? [...v].map((c) => c.charCodeAt(0)) : [v])));
const u32 = (n: number) => [(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255];

describe("sniffPhotoKind: what the bytes are, whatever the name says", () => {
  it("JPEG starts with the SOI marker FF D8 and another marker (ITU-T T.81, marker table B.1)", () => {
    expect(sniffPhotoKind(bytes(0xff, 0xd8, 0xff, 0xe0, 0, 16, "JFIF"))).toBe("jpeg");
    expect(sniffPhotoKind(bytes(0xff, 0xd8))).toBeNull();
  });
  it("PNG has its 8-byte signature 89 50 4E 47 0D 0A 1A 0A (PNG specification, 5.2)", () => {
    expect(sniffPhotoKind(bytes(0x89, "PNG", 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, "IHDR"))).toBe("png");
    expect(sniffPhotoKind(bytes(0x89, "PNG", 0x0d, 0x0a, 0x1a, 0x00))).toBeNull();
  });
  it("WebP is a RIFF container whose form type is WEBP (RFC 9649, the RIFF header)", () => {
    expect(sniffPhotoKind(bytes("RIFF", ...u32(0), "WEBPVP8 "))).toBe("webp");
    expect(sniffPhotoKind(bytes("RIFF", ...u32(0), "WAVEfmt "))).toBeNull();
  });
  it("HEIC is an ISO-BMFF ftyp box with an HEVC brand, as major or compatible brand (ISO/IEC 23008-12 brands; section from memory)", () => {
    expect(sniffPhotoKind(bytes(...u32(24), "ftyp", "heic", 0, 0, 0, 0, "mif1", "heic"))).toBe("heic");
    expect(sniffPhotoKind(bytes(...u32(24), "ftyp", "mif1", 0, 0, 0, 0, "mif1", "heic"))).toBe("heic");
    // AVIF shares the container but is not one of the four kinds we take.
    expect(sniffPhotoKind(bytes(...u32(24), "ftyp", "avif", 0, 0, 0, 0, "mif1", "miaf"))).toBeNull();
    expect(sniffPhotoKind(bytes(...u32(24), "ftyp", "mif1", 0, 0, 0, 0, "mif1", "avif"))).toBeNull();
  });
  it("a text file renamed .jpg, an SVG and a GIF are none of them", () => {
    expect(sniffPhotoKind(new TextEncoder().encode("Brake stroke 2.25 in, right rear\n"))).toBeNull();
    expect(sniffPhotoKind(new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"/>'))).toBeNull();
    expect(sniffPhotoKind(bytes("GIF89a", 1, 0, 1, 0))).toBeNull();
    expect(sniffPhotoKind(new Uint8Array())).toBeNull();
  });
  it("agrees with a general-purpose image library on real encodings (sharp/libvips output)", async () => {
    const base = sharp({ create: { width: 8, height: 8, channels: 3, background: "#808080" } });
    expect(sniffPhotoKind(await base.clone().jpeg().toBuffer())).toBe("jpeg");
    expect(sniffPhotoKind(await base.clone().png().toBuffer())).toBe("png");
    expect(sniffPhotoKind(await base.clone().webp().toBuffer())).toBe("webp");
    expect(sniffPhotoKind(await base.clone().gif().toBuffer())).toBeNull();
  });
});

describe("refusals before upload (our rules: JPEG, PNG, WebP, HEIC; 8 MB each; 8 per finding)", () => {
  it("takes the four kinds by type, or by name when the browser gives no type", () => {
    expect(declaredKind({ name: "a.jpg", type: "image/jpeg" })).toBe("jpeg");
    expect(declaredKind({ name: "IMG_0042.HEIC", type: "" })).toBe("heic");
    expect(declaredKind({ name: "scan.pdf", type: "application/pdf" })).toBeNull();
    expect(declaredKind({ name: "drawing.svg", type: "image/svg+xml" })).toBeNull();
  });
  it("refuses a 20 MB photo with its size in the message, and takes exactly 8 MB", () => {
    expect(refusalFor({ name: "big.jpg", size: 20 * 1024 * 1024, type: "image/jpeg" })).toBe("big.jpg is 20.0 MB; a photo may be at most 8 MB.");
    expect(refusalFor({ name: "edge.jpg", size: PHOTO_MAX_BYTES, type: "image/jpeg" })).toBeNull();
    expect(refusalFor({ name: "over.jpg", size: PHOTO_MAX_BYTES + 1, type: "image/jpeg" })).toMatch(/at most 8 MB/);
  });
  it("counts photos already on the finding against the eight", () => {
    const file = { name: "p.jpg", size: 1000, type: "image/jpeg" };
    expect(refusalsFor(Array(8).fill(file))).toEqual([]);
    expect(refusalsFor(Array(3).fill(file), 6)).toEqual(["A finding takes at most 8 photos; there is room for 2 more."]);
    expect(refusalsFor([{ name: "notes.txt", size: 10, type: "text/plain" }])).toEqual([
      "notes.txt is not a photo we can take: send JPEG, PNG, WebP or HEIC only.",
    ]);
  });
  it("an occurrence-log entry takes one photo, under the same type and size rules (issue 6: “an optional photo”)", () => {
    const file = { name: "dash.jpg", size: 1000, type: "image/jpeg" };
    expect(refusalsFor([file], 0, OCCURRENCE_PHOTOS)).toEqual([]);
    expect(refusalsFor([file, file], 0, OCCURRENCE_PHOTOS)).toEqual(["An entry in the occurrence log takes one photo."]);
    expect(refusalsFor([{ ...file, size: 20 * 1024 * 1024 }], 0, OCCURRENCE_PHOTOS)).toEqual(["dash.jpg is 20.0 MB; a photo may be at most 8 MB."]);
  });
});

describe("jpegHasGps (EXIF 2.32, CIPA DC-008: tag 0x8825 in IFD0 points at the GPS IFD)", () => {
  it("finds the GPS block a camera writes and nothing in a photo without one", async () => {
    const base = sharp({ create: { width: 16, height: 16, channels: 3, background: "#555" } });
    const withGps = await base
      .clone()
      .withExif({ IFD0: { Make: "Generic" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "45/1 30/1 0/1" } })
      .jpeg()
      .toBuffer();
    const withoutGps = await base.clone().withExif({ IFD0: { Make: "Generic" } }).jpeg().toBuffer();
    expect(jpegHasGps(withGps)).toBe(true);
    expect(jpegHasGps(withoutGps)).toBe(false);
    expect(jpegHasGps(await base.clone().jpeg().toBuffer())).toBe(false);
  });
});
