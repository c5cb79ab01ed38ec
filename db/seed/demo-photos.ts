import sharp from "sharp";
import { UTApi, UTFile } from "uploadthing/server";
import { cleanPhoto } from "@/lib/uploads/clean-photo";
import { uploadThingConfig } from "@/lib/uploads/config";
import { startFakeUploadThing } from "@/mocks/uploadthing/server";
import { fakeStorageDir } from "@/mocks/uploadthing/storage-dir";
import { DEMO_DRAWINGS, type DemoDrawing } from "./demo-drawings";

export interface StoredDemoPhoto {
  name: string;
  fileKey: string;
  fileUrl: string;
  thumbKey: string;
  thumbUrl: string;
  sizeBytes: number;
  width: number;
  height: number;
}

export type DemoPhotos = Map<DemoDrawing, StoredDemoPhoto>;

/**
 * Renders the demo drawings and stores them the way a technician's photo is
 * stored (clean full size + thumbnail through UTApi). With no UPLOADTHING_TOKEN
 * the seed runs a short-lived fake on the same storage folder the long-running
 * fake serves from, because the seed runs before `npm run mocks` starts.
 */
export async function storeDemoPhotos(): Promise<DemoPhotos> {
  // A script, not the server: it builds its own SDK client from the same settings the app uses.
  if (process.env.UPLOADTHING_TOKEN) return uploadAll(new UTApi({ token: uploadThingConfig().token, logLevel: "Error" }));
  const fake = await startFakeUploadThing({ port: 0, storageDir: fakeStorageDir(), onWarning: () => undefined });
  try {
    return await uploadAll(new UTApi({ token: fake.token, apiUrl: fake.url, ingestUrl: fake.url, logLevel: "Error" }));
  } finally {
    await fake.close();
  }
}

async function uploadAll(api: UTApi): Promise<DemoPhotos> {
  const names = Object.keys(DEMO_DRAWINGS) as DemoDrawing[];
  const cleaned = await Promise.all(
    names.map(async (name) => cleanPhoto(await sharp(Buffer.from(DEMO_DRAWINGS[name])).jpeg({ quality: 88 }).toBuffer(), "jpeg")),
  );
  const files = cleaned.flatMap((c, i) => [
    new UTFile([new Uint8Array(c.full)], `demo-${names[i]}.jpg`, { type: "image/jpeg" }),
    new UTFile([new Uint8Array(c.thumb)], `demo-${names[i]}-thumb.jpg`, { type: "image/jpeg" }),
  ]);
  const results = await quietly(() => api.uploadFiles(files));
  const photos: DemoPhotos = new Map();
  names.forEach((name, i) => {
    const full = results[i * 2]?.data;
    const thumb = results[i * 2 + 1]?.data;
    const clean = cleaned[i];
    if (!full || !thumb || !clean) throw new Error(`seed: demo photo ${name} was not stored`);
    photos.set(name, {
      name: `${name}.jpg`,
      fileKey: full.key,
      fileUrl: full.ufsUrl,
      thumbKey: thumb.key,
      thumbUrl: thumb.ufsUrl,
      sizeBytes: clean.full.length,
      width: clean.width,
      height: clean.height,
    });
  });
  return photos;
}

/** The SDK warns about its own deprecated fields once per file it uploads; the seed has nothing to fix there. */
async function quietly<T>(fn: () => Promise<T>): Promise<T> {
  const warn = console.warn;
  console.warn = (...args: unknown[]) => {
    if (typeof args[0] === "string" && args[0].includes("[uploadthing][deprecated]")) return;
    warn(...args);
  };
  try {
    return await fn();
  } finally {
    console.warn = warn;
  }
}
