// Photos uploaded but never put on a finding or an occurrence (a form left
// unsent) are deleted after a week, rows and stored files, through the real
// UTApi against the local upload fake. The week is our own choice (common
// practice for abandoned uploads); attached photos are never touched.
import { eq, isNotNull } from "drizzle-orm";
import { UTFile } from "uploadthing/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { photos, units } from "@/db/schema";
import { KEEP_UNATTACHED_MS, sweepUnattachedPhotos } from "@/lib/server/uploads/sweep-photos";
import { utApi } from "@/lib/server/uploads/ut-api";
import { userByEmail } from "./helpers/app";
import { startUploadFake, type UploadFake } from "./helpers/fake-uploads";

let uploads: UploadFake;
beforeAll(async () => {
  uploads = await startUploadFake("cotter-sweep");
});
afterAll(() => uploads?.stop());

async function storedKeys(): Promise<string[]> {
  const { files } = await utApi().listFiles({ limit: 500 });
  return files.map((f) => f.key);
}

/** An upload as the finding form leaves it: clean copy and thumbnail stored, on no finding yet. */
async function unattachedPhoto(createdAt: Date): Promise<{ id: string; keys: string[] }> {
  const [unit] = await getDb().select().from(units).limit(1);
  const tech = await userByEmail("tech@quarry-road.example");
  const stored = await utApi().uploadFiles([
    new UTFile([new Uint8Array([0xff, 0xd8, 0xff, 0xd9])], "left.jpg", { type: "image/jpeg" }),
    new UTFile([new Uint8Array([0xff, 0xd8, 0xff, 0xd9])], "left-thumb.jpg", { type: "image/jpeg" }),
  ]);
  const [full, thumb] = stored.map((r) => r.data!);
  const [row] = await getDb()
    .insert(photos)
    .values({
      accountId: unit!.accountId, unitId: unit!.id, uploadedBy: tech.id, mime: "image/jpeg", name: "left.jpg",
      fileKey: full!.key, fileUrl: full!.ufsUrl, thumbKey: thumb!.key, thumbUrl: thumb!.ufsUrl,
      createdAt: createdAt.toISOString(),
    })
    .returning({ id: photos.id });
  return { id: row!.id, keys: [full!.key, thumb!.key] };
}

describe("sweeping unattached photos", () => {
  it("deletes week-old unattached photos and their files, keeps newer ones and every attached photo", async () => {
    const now = new Date("2026-12-01T12:00:00Z");
    const attachedBefore = await getDb().select({ id: photos.id }).from(photos).where(isNotNull(photos.findingId));
    const old = await unattachedPhoto(new Date(now.getTime() - KEEP_UNATTACHED_MS - 60_000));
    const recent = await unattachedPhoto(new Date(now.getTime() - KEEP_UNATTACHED_MS + 60_000));

    expect(await sweepUnattachedPhotos(now)).toBe(1);

    expect(await getDb().select().from(photos).where(eq(photos.id, old.id))).toEqual([]);
    expect(await getDb().select().from(photos).where(eq(photos.id, recent.id))).toHaveLength(1);
    const keys = await storedKeys();
    for (const k of old.keys) expect(keys).not.toContain(k);
    for (const k of recent.keys) expect(keys).toContain(k);
    expect(await getDb().select({ id: photos.id }).from(photos).where(isNotNull(photos.findingId))).toEqual(attachedBefore);
    // Nothing left to take: a second sweep is a no-op.
    expect(await sweepUnattachedPhotos(now)).toBe(0);
  });
});
