// A photo on an occurrence-log entry: uploaded by a fleet person through the real UploadThing SDK
// (client uploader, the app's own route handler and UTApi) against the local fake in
// mocks/uploadthing, attached when the entry is posted, then served through the scoped photo
// routes. Sources: api-v1.md (404 for another account, invalid_input with field errors); the
// JPEG EXIF GPS pointer as in tests/unit/uploads/photo-rules.test.ts (EXIF 2.32, CIPA DC-008).
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, count, eq } from "drizzle-orm";
import sharp from "sharp";
import { genUploader } from "uploadthing/client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as photoFull } from "@/app/api/v1/photos/[id]/route";
import { GET as photoThumb } from "@/app/api/v1/photos/[id]/thumb/route";
import { GET as list, POST as post } from "@/app/api/v1/units/[id]/occurrences/route";
import { GET as getOne, PATCH as patch } from "@/app/api/v1/units/[id]/occurrences/[occurrenceId]/route";
import type { PhotoRouter } from "@/app/api/uploadthing/core";
import { GET as utGet, POST as utPost } from "@/app/api/uploadthing/route";
import { getDb } from "@/db/client";
import { mailOutbox, occurrences, photos, units, workOrders } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { jpegHasGps } from "@/lib/uploads/exif-gps";
import type { PhotoUploadResult } from "@/lib/server/uploads/store-photo";
import { startFakeUploadThing, type FakeUploadThing } from "@/mocks/uploadthing/server";
import { call, checked, sessionCookie, userByEmail, type Problem } from "./helpers/app";
import { installNodeXhr } from "./helpers/node-xhr";
import { serveFetchHandler } from "./helpers/serve-fetch-handler";
import { fileMailbox } from "./helpers/mail";

const FOREMAN = "foreman@brennan-twp.example"; // viewer, township
const SUPERVISOR = "supervisor@brennan-twp.example"; // approver, township
const CLERK = "clerk@brennan-twp.example"; // clerk, township
const BUS_OFFICE = "transport@alder-falls-schools.example"; // approver, schools
const TECH = "tech@quarry-road.example";
const WRITER = "writer@quarry-road.example";

interface Entry {
  id: string;
  photo: { id: string; url: string; thumbUrl: string } | null;
}
type Posted = Entry & Problem;

let fake: FakeUploadThing;
const smtp = fileMailbox();
let app: { url: string; close(): Promise<void> };
let storage: string;
let uninstallXhr = (): void => {};
let t9: string;
let t14: string;
let posted = 0;

async function unitId(unitNumber: string) {
  const [u] = await getDb().select({ id: units.id }).from(units).where(eq(units.unitNumber, unitNumber)).limit(1);
  return u!.id;
}

beforeAll(async () => {
  storage = await mkdtemp(join(tmpdir(), "cotter-occurrence-photos-"));
  fake = await startFakeUploadThing({ port: 0, storageDir: storage, onWarning: () => undefined });
  delete process.env.UPLOADTHING_TOKEN;
  process.env.FAKE_UPLOADTHING_PORT = new URL(fake.url).port;
  resetEnvCache();
  uninstallXhr = installNodeXhr();
  app = await serveFetchHandler((request) => (request.method === "GET" ? utGet(request) : utPost(request)));
  t9 = await unitId("T-9");
  t14 = await unitId("T-14");
});

afterAll(async () => {
  // Queued mail goes out within moments: let it land before the mail catcher stops.
  for (let i = 0; i < 100; i += 1) {
    const [row] = await getDb().select({ n: count() }).from(mailOutbox).where(and(eq(mailOutbox.template, "occurrence-logged"), eq(mailOutbox.status, "sent")));
    if ((row?.n ?? 0) >= posted * 2) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  uninstallXhr();
  delete process.env.FAKE_UPLOADTHING_PORT;
  delete process.env.SMTP_URL;
  resetEnvCache();
  await Promise.all([app?.close(), fake?.close()]);
  await rm(storage, { recursive: true, force: true });
});

async function uploadFor(unit: string, as: string, files: File[]) {
  const { uploadFiles } = genUploader<PhotoRouter>({ url: new URL("/api/uploadthing", app.url), package: "vitest", fetch: globalThis.fetch });
  return uploadFiles("occurrencePhoto", { files, input: { unitId: unit }, headers: { cookie: await sessionCookie(as) } });
}

/** Uploads one photo and returns its id, failing the test if the server refused it. */
async function photoFor(unit: string, as: string, file?: File): Promise<string> {
  const [result] = await uploadFor(unit, as, [file ?? (await pngPhoto("dash.png"))]);
  const data = result?.serverData as PhotoUploadResult;
  if (!data.ok) throw new Error(data.error);
  return data.photoId;
}

/** A phone photo of the dash: a JPEG that says where it was taken (GPS in EXIF). */
async function phonePhoto(name: string): Promise<File> {
  const bytes = await sharp({ create: { width: 1200, height: 900, channels: 3, background: "#3d4a52" } })
    .withExif({ IFD0: { Make: "Generic phone" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "45/1 31/1 12/1", GPSLongitudeRef: "W", GPSLongitude: "93/1 14/1 5/1" } })
    .jpeg({ quality: 85 })
    .toBuffer();
  expect(jpegHasGps(bytes)).toBe(true);
  return new File([new Uint8Array(bytes)], name, { type: "image/jpeg" });
}

async function pngPhoto(name: string): Promise<File> {
  const bytes = await sharp({ create: { width: 640, height: 480, channels: 4, background: "#8a7a60" } }).png().toBuffer();
  return new File([new Uint8Array(bytes)], name, { type: "image/png" });
}

async function postAs(as: string, unit: string, body: Record<string, unknown>) {
  const res = await call<Posted>(post, {
    path: `/api/v1/units/${unit}/occurrences`,
    params: { id: unit },
    as,
    body: { occurredAt: new Date().toISOString(), symptom: "no_start", ...body },
  });
  if (res.status === 201) posted += 1;
  return res;
}

const served = async (handler: typeof photoFull, url: string, as: string | null) => {
  const id = url.split("/")[4] ?? "";
  const request = new Request(`http://localhost:3000${url}`, { headers: as ? { cookie: await sessionCookie(as) } : {} });
  return checked(request, handler(request, { params: Promise.resolve({ id }) }));
};

async function photoRow(id: string) {
  const [row] = await getDb().select().from(photos).where(eq(photos.id, id));
  return row;
}

async function entriesOn(unit: string) {
  const [row] = await getDb().select({ n: count() }).from(occurrences).where(eq(occurrences.unitId, unit));
  return row?.n ?? 0;
}

describe("the occurrencePhoto upload endpoint", () => {
  it("takes the foreman's phone photo for the unit: cleaned of GPS, on the unit and account, on no visit, not yet on an entry", async () => {
    const id = await photoFor(t9, FOREMAN, await phonePhoto("dash-lights.jpg"));
    const row = await photoRow(id);
    expect(row).toMatchObject({ unitId: t9, accountId: (await userByEmail(FOREMAN)).accountId, workOrderId: null, findingId: null, occurrenceId: null });
    expect(row?.uploadedBy).toBe((await userByEmail(FOREMAN)).id);
    // The uploader sees their own photo on the phone at once; nobody else in the fleet does until it is posted.
    const mine = await served(photoThumb, `/api/v1/photos/${id}/thumb`, FOREMAN);
    expect(mine.status).toBe(200);
    expect(jpegHasGps(new Uint8Array(await mine.arrayBuffer()))).toBe(false);
    expect((await served(photoThumb, `/api/v1/photos/${id}/thumb`, SUPERVISOR)).status).toBe(404);
    expect((await served(photoFull, `/api/v1/photos/${id}`, BUS_OFFICE)).status).toBe(404);
  });

  it("shop staff may upload too; another account's person, a second file and no session are refused before any byte is sent", async () => {
    expect(await photoFor(t9, WRITER)).toBeTruthy();
    await expect(uploadFor(t9, BUS_OFFICE, [await pngPhoto("a.png")])).rejects.toMatchObject({ message: "That unit was not found." });
    await expect(uploadFor(t9, FOREMAN, [await pngPhoto("a.png"), await pngPhoto("b.png")])).rejects.toMatchObject({
      message: "An entry in the occurrence log takes one photo.",
    });
    const { uploadFiles } = genUploader<PhotoRouter>({ url: new URL("/api/uploadthing", app.url), package: "vitest", fetch: globalThis.fetch });
    await expect(uploadFiles("occurrencePhoto", { files: [await pngPhoto("a.png")], input: { unitId: t9 } })).rejects.toMatchObject({
      message: "Your session has ended. Sign in again to add photos.",
    });
    const big = new File([new Uint8Array(9 * 1024 * 1024)], "video-frame.jpg", { type: "image/jpeg" });
    await expect(uploadFor(t9, FOREMAN, [big])).rejects.toMatchObject({ message: "video-frame.jpg is 9.0 MB; a photo may be at most 8 MB." });
  });
});

describe("POST /api/v1/units/:id/occurrences with photoId", () => {
  it("attaches the caller's own upload in the same write; the API answers with its scoped URLs", async () => {
    const id = await photoFor(t9, FOREMAN);
    const res = await postAs(FOREMAN, t9, { hoursParked: 14, ambientF: 9, note: "Photo of the dash", photoId: id });
    expect(res.status).toBe(201);
    expect(res.body.photo).toEqual({ id, url: `/api/v1/photos/${id}`, thumbUrl: `/api/v1/photos/${id}/thumb` });
    expect((await photoRow(id))?.occurrenceId).toBe(res.body.id);

    const one = await call<Entry>(getOne, { path: `/api/v1/units/${t9}/occurrences/${res.body.id}`, params: { id: t9, occurrenceId: res.body.id }, as: CLERK });
    expect(one.body.photo?.thumbUrl).toBe(`/api/v1/photos/${id}/thumb`);
    const log = await call<{ occurrences: Entry[] }>(list, { path: `/api/v1/units/${t9}/occurrences?limit=200`, params: { id: t9 }, as: TECH });
    expect(log.body.occurrences.find((e) => e.id === res.body.id)?.photo?.url).toBe(`/api/v1/photos/${id}`);
    // Entries without a photo still say so plainly.
    expect(log.body.occurrences.filter((e) => e.photo === null).length).toBeGreaterThan(0);

    // The writer and technician are told there is a photo to look at.
    const mail = await smtp.waitFor((m) => m.to.includes(TECH) && m.text.includes("Photo of the dash"));
    expect(mail.text).toContain("Attached: open the log to see it");
  });

  it("the township's other people and the shop load it; another account's user gets 404 on both URLs", async () => {
    const id = await photoFor(t9, FOREMAN, await phonePhoto("gauge.jpg"));
    const res = await postAs(FOREMAN, t9, { photoId: id });
    expect(res.status).toBe(201);
    const { url, thumbUrl } = res.body.photo!;
    for (const who of [FOREMAN, SUPERVISOR, CLERK, TECH, WRITER]) {
      const full = await served(photoFull, url, who);
      expect(full.status, who).toBe(200);
      expect(full.headers.get("content-type")).toBe("image/jpeg");
      const bytes = new Uint8Array(await full.arrayBuffer());
      expect(jpegHasGps(bytes)).toBe(false);
      expect((await sharp(bytes).metadata()).width).toBe(1200);
      const thumb = await served(photoThumb, thumbUrl, who);
      expect(thumb.status, who).toBe(200);
      expect((await sharp(new Uint8Array(await thumb.arrayBuffer())).metadata()).width).toBe(320);
    }
    for (const u of [url, thumbUrl]) {
      const other = await served(u.endsWith("/thumb") ? photoThumb : photoFull, u, BUS_OFFICE);
      expect(other.status).toBe(404);
      expect(((await other.json()) as Problem).code).toBe("not_found");
    }
    expect((await served(photoFull, url, null)).status).toBe(401);
  });

  it("refuses with 400 on photoId (and logs nothing) someone else's upload, another unit's, a used one, an unknown one, a finding's", async () => {
    const supervisors = await photoFor(t9, SUPERVISOR);
    const otherUnit = await photoFor(t14, FOREMAN);
    const used = await photoFor(t9, FOREMAN);
    expect((await postAs(FOREMAN, t9, { photoId: used })).status).toBe(201);
    // A technician's photo for a finding on T-9's visit is not an occurrence photo, even for the technician.
    const [visit] = await getDb().select({ id: workOrders.id }).from(workOrders).where(eq(workOrders.unitId, t9)).limit(1);
    const findingPhoto = await photoFor(t9, TECH);
    await getDb().update(photos).set({ workOrderId: visit!.id }).where(eq(photos.id, findingPhoto));

    const cases: [string, string, string][] = [
      ["someone else's upload", FOREMAN, supervisors],
      ["another unit's upload", FOREMAN, otherUnit],
      ["already on an entry", FOREMAN, used],
      ["no such photo", FOREMAN, "no-such-photo"],
      ["a finding's upload", TECH, findingPhoto],
    ];
    for (const [what, who, photoId] of cases) {
      const before = await entriesOn(t9);
      const res = await postAs(who, t9, { note: `refused: ${what}`, photoId });
      expect(res.status, what).toBe(400);
      expect(res.body.code, what).toBe("invalid_input");
      expect(res.body.errors?.map((e) => e.path), what).toEqual(["photoId"]);
      expect(await entriesOn(t9), what).toBe(before);
    }
    expect((await photoRow(supervisors))?.occurrenceId).toBeNull();
    // A retry after a lost answer is told the first send already carried this photo.
    const retry = await postAs(FOREMAN, t9, { photoId: used });
    expect(retry.body.errors?.[0]?.message).toMatch(/already on an entry you logged/);
    const wrongType = await postAs(FOREMAN, t9, { photoId: 42 });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.errors?.map((e) => e.path)).toEqual(["photoId"]);
  });
});

describe("PATCH …/occurrences/:occurrenceId with photoId", () => {
  it("the author adds, replaces and removes the photo; a refused photo leaves the entry as it was", async () => {
    const res = await postAs(FOREMAN, t14, { note: "photo later" });
    expect(res.body.photo).toBeNull();
    const entry = res.body.id;
    const patchAs = (as: string, body: unknown) =>
      call<Posted>(patch, { path: `/api/v1/units/${t14}/occurrences/${entry}`, params: { id: t14, occurrenceId: entry }, as, method: "PATCH", body });

    const first = await photoFor(t14, FOREMAN);
    expect((await patchAs(FOREMAN, { photoId: first })).body.photo?.id).toBe(first);
    // Sending the same photo again changes nothing.
    expect((await patchAs(FOREMAN, { photoId: first })).status).toBe(200);

    const someoneElses = await photoFor(t14, SUPERVISOR);
    const refused = await patchAs(FOREMAN, { photoId: someoneElses });
    expect(refused.status).toBe(400);
    expect(refused.body.errors?.map((e) => e.path)).toEqual(["photoId"]);
    expect((await photoRow(first))?.occurrenceId).toBe(entry);

    // Another person of the account may not change the entry at all (403), photo or not.
    expect((await patchAs(SUPERVISOR, { photoId: someoneElses })).status).toBe(403);

    const second = await photoFor(t14, FOREMAN);
    expect((await patchAs(FOREMAN, { photoId: second })).body.photo?.id).toBe(second);
    expect((await photoRow(first))?.occurrenceId).toBeNull();
    // The photo taken off is no longer shown to the rest of the account.
    expect((await served(photoFull, `/api/v1/photos/${first}`, SUPERVISOR)).status).toBe(404);

    expect((await patchAs(FOREMAN, { photoId: null })).body.photo).toBeNull();
    const left = await getDb().select({ id: photos.id }).from(photos).where(and(eq(photos.occurrenceId, entry)));
    expect(left).toEqual([]);
  });
});
