// A technician's photos through the real UploadThing SDK (client uploader, the app's own route
// handler and UTApi) against the local fake in mocks/uploadthing, then onto a finding, then back
// out through the scoped photo routes. Sources: the SDK's protocol as the fake's own test names
// it; PNG/JPEG signatures and the EXIF GPS pointer as in tests/unit/uploads/photo-rules.test.ts.
import { readFile, readdir, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { genUploader } from "uploadthing/client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as photoFull } from "@/app/api/v1/photos/[id]/route";
import { GET as photoThumb } from "@/app/api/v1/photos/[id]/thumb/route";
import { GET as oneFinding } from "@/app/api/v1/findings/[id]/route";
import { POST as postFinding } from "@/app/api/v1/work-orders/[id]/findings/route";
import { photoRouter, type PhotoRouter } from "@/app/api/uploadthing/core";
import { GET as utGet, POST as utPost } from "@/app/api/uploadthing/route";
import { getDb } from "@/db/client";
import { photos } from "@/db/schema";
import { jpegHasGps } from "@/lib/uploads/exif-gps";
import type { PhotoUploadResult } from "@/lib/server/uploads/store-photo";
import { call, checked, sessionCookie } from "./helpers/app";
import { startUploadFake, type UploadFake } from "./helpers/fake-uploads";
import { installNodeXhr } from "./helpers/node-xhr";
import { serveFetchHandler } from "./helpers/serve-fetch-handler";
import { workOrderByNumber } from "./helpers/work-orders";

let uploads: UploadFake;
let app: { url: string; close(): Promise<void> };
let uninstallXhr = (): void => {};
const TECH = "tech2@quarry-road.example";

beforeAll(async () => {
  // No UPLOADTHING_TOKEN: the app derives the fake's token and address from its port alone.
  uploads = await startUploadFake("cotter-photos");
  uninstallXhr = installNodeXhr();
  app = await serveFetchHandler((request) => (request.method === "GET" ? utGet(request) : utPost(request)));
});

afterAll(async () => {
  uninstallXhr();
  await Promise.all([app?.close(), uploads?.stop()]);
});

async function upload(files: File[], workOrderId: string, as = TECH) {
  const { uploadFiles } = genUploader<PhotoRouter>({ url: new URL("/api/uploadthing", app.url), package: "vitest", fetch: globalThis.fetch });
  return uploadFiles("findingPhotos", { files, input: { workOrderId, attached: 0 }, headers: { cookie: await sessionCookie(as) } });
}

/** A phone photo: a JPEG that says where it was taken (GPS in EXIF). */
async function phonePhoto(name: string): Promise<File> {
  const bytes = await sharp({ create: { width: 1600, height: 1200, channels: 3, background: "#6b6256" } })
    .withExif({
      IFD0: { Make: "Generic phone" },
      IFD3: { GPSLatitudeRef: "N", GPSLatitude: "45/1 31/1 12/1", GPSLongitudeRef: "W", GPSLongitude: "93/1 14/1 5/1" },
    })
    .jpeg({ quality: 85 })
    .toBuffer();
  expect(jpegHasGps(bytes)).toBe(true);
  return new File([new Uint8Array(bytes)], name, { type: "image/jpeg" });
}

async function pngPhoto(name: string): Promise<File> {
  const bytes = await sharp({ create: { width: 900, height: 600, channels: 4, background: "#8a7a60" } }).png().toBuffer();
  return new File([new Uint8Array(bytes)], name, { type: "image/png" });
}

const served = (handler: typeof photoFull, id: string, as: string) => {
  const request = new Request(`http://localhost:3000/api/v1/photos/${id}`, { headers: { cookie: as } });
  return checked(request, handler(request, { params: Promise.resolve({ id }) }));
};

describe("a technician's finding with two photos, through the upload SDK and the local fake", () => {
  it("stores clean copies without location data, attaches them, and shows them only within the account", async () => {
    const wo = await workOrderByNumber(1044); // Bus 22, the school district's
    const results = await upload([await phonePhoto("right-rear-chamber.jpg"), await pngPhoto("slack-adjuster.png")], wo.id);
    expect(results).toHaveLength(2);
    const data = results.map((r) => r.serverData as PhotoUploadResult);
    const ok = data.filter((d): d is Extract<PhotoUploadResult, { ok: true }> => d.ok);
    expect(ok).toHaveLength(2);

    // Only the clean copies (full + thumbnail) are left at the upload service: the originals are gone.
    expect((await readdir(uploads.storage)).filter((f) => f.endsWith(".json"))).toHaveLength(4);
    const rows = await getDb().select().from(photos).where(eq(photos.workOrderId, wo.id));
    expect(rows.map((r) => r.findingId)).toEqual([null, null]);

    const res = await call<{ id: string; photos: { url: string; thumbUrl: string }[] }>(postFinding, {
      path: `/api/v1/work-orders/${wo.id}/findings`,
      params: { id: wo.id },
      as: TECH,
      body: {
        title: "Right rear chamber and slack adjuster",
        severity: "fix_now",
        photoIds: ok.map((p) => p.photoId),
        readings: [{ kind: "brake_stroke", chamberType: 30, strokeClass: "standard", value: 2.25 }],
      },
    });
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(2);
    expect(res.body.photos).toEqual(
      expect.arrayContaining(ok.map((p) => expect.objectContaining({ url: `/api/v1/photos/${p.photoId}`, thumbUrl: `/api/v1/photos/${p.photoId}/thumb` }))),
    );

    const approver = await sessionCookie("transport@alder-falls-schools.example");
    for (const p of ok) {
      const full = await served(photoFull, p.photoId, approver);
      expect(full.status).toBe(200);
      expect(full.headers.get("content-type")).toBe("image/jpeg");
      const bytes = new Uint8Array(await full.arrayBuffer());
      expect(jpegHasGps(bytes)).toBe(false);
      expect((await sharp(bytes).metadata()).exif).toBeUndefined();
      const thumb = await served(photoThumb, p.photoId, approver);
      expect(thumb.status).toBe(200);
      expect((await sharp(new Uint8Array(await thumb.arrayBuffer())).metadata()).width).toBe(320);
    }

    // Another account's people get 404 on the finding and on every photo URL, as for an id that does not exist.
    const other = await sessionCookie("supervisor@brennan-twp.example");
    expect((await call(oneFinding, { path: `/api/v1/findings/${res.body.id}`, params: { id: res.body.id }, as: "supervisor@brennan-twp.example" })).status).toBe(404);
    for (const p of ok) {
      expect((await served(photoFull, p.photoId, other)).status).toBe(404);
      expect((await served(photoThumb, p.photoId, other)).status).toBe(404);
    }
    expect((await served(photoFull, ok[0]!.photoId, "")).status).toBe(401);
  });

  it("takes a phone's HEIC photo and serves it as a plain JPEG (HEVC-coded HEIF, decoded by heic-convert)", async () => {
    const wo = await workOrderByNumber(1044);
    const heic = await readFile(join(import.meta.dirname, "..", "fixtures", "brake-chamber-drawing.heic"));
    const [result] = await upload([new File([new Uint8Array(heic)], "IMG_0042.HEIC", { type: "image/heic" })], wo.id);
    const data = result?.serverData as PhotoUploadResult;
    if (!data.ok) throw new Error(data.error);
    expect([data.width, data.height]).toEqual([640, 480]);
    const res = await call(postFinding, {
      path: `/api/v1/work-orders/${wo.id}/findings`,
      params: { id: wo.id },
      as: TECH,
      body: { title: "Chamber clamp ring", severity: "note", photoIds: [data.photoId] },
    });
    expect(res.status).toBe(201);
    const full = await served(photoFull, data.photoId, await sessionCookie("transport@alder-falls-schools.example"));
    expect(full.headers.get("content-type")).toBe("image/jpeg");
    const bytes = new Uint8Array(await full.arrayBuffer());
    expect((await sharp(bytes).metadata()).format).toBe("jpeg");
    expect(jpegHasGps(bytes)).toBe(false);
  });

  it("serves a photo by what its bytes are: a stored file that is not an image is never sent", async () => {
    const wo = await workOrderByNumber(1044);
    const [result] = await upload([await phonePhoto("hub-seal.jpg")], wo.id);
    const data = result?.serverData as PhotoUploadResult;
    if (!data.ok) throw new Error(data.error);
    const [row] = await getDb().select({ fileKey: photos.fileKey, thumbKey: photos.thumbKey }).from(photos).where(eq(photos.id, data.photoId)).limit(1);
    const owner = await sessionCookie("owner@quarry-road.example");
    expect((await served(photoFull, data.photoId, owner)).headers.get("content-type")).toBe("image/jpeg");
    // Storage now holds a page of HTML under the thumbnail's key.
    await writeFile(join(uploads.storage, row!.thumbKey!), "<html><script>alert(1)</script></html>");
    const thumb = await served(photoThumb, data.photoId, owner);
    expect(thumb.status).toBe(502);
    expect(thumb.headers.get("content-type")).toBe("application/problem+json");
  });

  it("works the same under `next dev`, where the fake streams the callback back to the route handler", async () => {
    const wo = await workOrderByNumber(1044);
    process.env.UPLOADTHING_IS_DEV = "true";
    try {
      const [result] = await upload([await pngPhoto("dev-mode.png")], wo.id);
      expect(result?.serverData).toMatchObject({ ok: true, name: "dev-mode.png" });
    } finally {
      delete process.env.UPLOADTHING_IS_DEV;
    }
  });

  it("refuses a 20 MB file before anything is uploaded, with its size in the message", async () => {
    const wo = await workOrderByNumber(1044);
    const before = (await readdir(uploads.storage)).length;
    const big = new File([new Uint8Array(20 * 1024 * 1024)], "whole-axle.jpg", { type: "image/jpeg" });
    await expect(upload([big], wo.id)).rejects.toMatchObject({ message: "whole-axle.jpg is 20.0 MB; a photo may be at most 8 MB." });
    expect((await readdir(uploads.storage)).length).toBe(before);
  });

  it("refuses a text file renamed .jpg by its contents, keeps nothing, and says why", async () => {
    const wo = await workOrderByNumber(1044);
    const before = await getDb().select().from(photos);
    const fakeJpeg = new File(["Right rear stroke 2 1/4 in. Needs a slack adjuster.\n"], "notes.jpg", { type: "image/jpeg" });
    const [result] = await upload([fakeJpeg], wo.id);
    expect(result?.serverData).toEqual({ ok: false, name: "notes.jpg", error: "notes.jpg is not a JPEG, PNG, WebP or HEIC photo, whatever its name says. It was not kept." });
    expect(await getDb().select().from(photos)).toHaveLength(before.length);
    // The upload service no longer holds it either.
    expect((await fetch(`${uploads.fake.url}/f/${result?.key}`)).status).toBe(404);
  });

  it("refuses uploads from fleet people and for another account's work order (the middleware runs first)", async () => {
    const wo = await workOrderByNumber(1044);
    await expect(upload([await pngPhoto("a.png")], wo.id, "transport@alder-falls-schools.example")).rejects.toMatchObject({
      message: "Your role may not add photos to findings.",
    });
    await expect(upload([await pngPhoto("a.png")], "no-such-work-order")).rejects.toMatchObject({ message: "That work order was not found." });
    expect(Object.keys(photoRouter)).toEqual(["findingPhotos", "occurrencePhoto"]);
  });

  it("will not attach another technician's photo", async () => {
    const wo = await workOrderByNumber(1044);
    const [uploaded] = await upload([await pngPhoto("mine.png")], wo.id, "tech@quarry-road.example");
    const mine = uploaded?.serverData as PhotoUploadResult;
    if (!mine.ok) throw new Error(mine.error);
    const res = await call(postFinding, {
      path: `/api/v1/work-orders/${wo.id}/findings`,
      params: { id: wo.id },
      as: TECH,
      body: { title: "Borrowed photo", severity: "note", photoIds: [mine.photoId] },
    });
    expect(res.status).toBe(400);
    // Until it is on a posted finding, the fleet cannot see it at all.
    expect((await served(photoFull, mine.photoId, await sessionCookie("transport@alder-falls-schools.example"))).status).toBe(404);
  });
});
