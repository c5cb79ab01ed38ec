// Protocol test for mocks/uploadthing: the real UploadThing SDK (uploadthing@7.7.4 — route handler,
// client uploader and UTApi) runs unchanged against the fake. Sources for the expected behaviour:
// the SDK's own code (node_modules/uploadthing/dist/upload-builder-*.js, client/index.js,
// server/index.js, @uploadthing/shared crypto) and the SDK maintainers' "Uploading Files" protocol
// page (docs.uploadthing.com/uploading-files); md5 per RFC 1321 via node:crypto.
import { createHash, randomBytes } from "node:crypto";
import { existsSync } from "node:fs";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { genUploader } from "uploadthing/client";
import { createRouteHandler, createUploadthing, UTApi, UTFile, type FileRouter } from "uploadthing/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startFakeUploadThing, type FakeUploadThing } from "@/mocks/uploadthing/server";
import { installNodeXhr } from "./helpers/node-xhr";
import { serveFetchHandler } from "./helpers/serve-fetch-handler";

interface Received {
  metadata: { shopId: string; uploadedBy: string };
  file: { key: string; name: string; size: number; type: string; customId: string | null; ufsUrl: string; fileHash: string };
}
const received: Received[] = [];
const uploadErrors: { fileKey: string; message: string }[] = [];

const f = createUploadthing();
const photoRoute = (routeOptions?: { presignedURLTTL: number }) =>
  f({ image: { maxFileSize: "8MB", maxFileCount: 8 } }, routeOptions)
    .middleware(({ req }) => ({ shopId: "shop-0042", uploadedBy: req.headers.get("x-test-user") ?? "anonymous" }))
    .onUploadError(({ error, fileKey }) => {
      uploadErrors.push({ fileKey, message: error.message });
    })
    .onUploadComplete(({ metadata, file }) => {
      const { key, name, size, type, customId, ufsUrl, fileHash } = file;
      received.push({ metadata, file: { key, name, size, type, customId, ufsUrl, fileHash } });
      return { storedAs: key, shopId: metadata.shopId };
    });
const router = {
  shopPhotos: photoRoute(),
  // A negative TTL makes the SDK sign URLs that are already expired.
  expiringPhotos: photoRoute({ presignedURLTTL: -60 }),
} satisfies FileRouter;

const png = (name: string, bodyBytes: number): { file: File; bytes: Buffer } => {
  const bytes = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), randomBytes(bodyBytes)]);
  return { file: new File([bytes], name, { type: "image/png", lastModified: 1_700_000_000_000 }), bytes };
};
const md5 = (b: Uint8Array): string => createHash("md5").update(b).digest("hex");

let configFake: FakeUploadThing; // reached through createRouteHandler's config object
let envFake: FakeUploadThing; // reached through UPLOADTHING_* environment variables
let prodApp: { url: string; close(): Promise<void> };
let devApp: { url: string; close(): Promise<void> };
const dirs: string[] = [];
const savedEnv = new Map<string, string | undefined>();
let uninstallXhr = (): void => {};

beforeAll(async () => {
  for (const name of ["a", "b"]) dirs.push(await mkdtemp(join(tmpdir(), `fake-ut-${name}-`)));
  configFake = await startFakeUploadThing({ port: 0, storageDir: dirs[0] ?? "", appId: "configapp01", apiKey: "sk_fake_config" });
  envFake = await startFakeUploadThing({ port: 0, storageDir: dirs[1] ?? "" });
  for (const [name, value] of Object.entries({ ...envFake.env, UPLOADTHING_LOG_LEVEL: "Error" })) {
    savedEnv.set(name, process.env[name]);
    process.env[name] = value;
  }
  uninstallXhr = installNodeXhr();
  const prodConfig = { token: configFake.token, ingestUrl: configFake.url, isDev: false, logLevel: "Error" as const };
  prodApp = await serveFetchHandler(createRouteHandler({ router, config: prodConfig }));
  // isDev: the fake streams callbacks back over the /route-metadata response (next dev's path).
  devApp = await serveFetchHandler(createRouteHandler({ router, config: { isDev: true } }));
});

afterAll(async () => {
  uninstallXhr();
  for (const [name, value] of savedEnv) {
    if (value === undefined) delete process.env[name];
    else process.env[name] = value;
  }
  await Promise.all([prodApp?.close(), devApp?.close(), configFake?.close(), envFake?.close()]);
  await Promise.all(dirs.map((d) => rm(d, { recursive: true, force: true })));
});

const uploaderFor = (app: { url: string }) =>
  genUploader<typeof router>({ url: new URL("/api/uploadthing", app.url), package: "vitest", fetch: globalThis.fetch });

/** The client's first call (uploadthing dist/ut-reporter): POST ?actionType=upload&slug=… */
async function presign(app: { url: string }, slug: string, files: { name: string; size: number; type: string }[]) {
  const res = await fetch(`${app.url}/api/uploadthing?actionType=upload&slug=${slug}`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-uploadthing-package": "vitest" },
    body: JSON.stringify({ input: null, files: files.map((x) => ({ ...x, lastModified: 1 })) }),
  });
  expect(res.status).toBe(200);
  return (await res.json()) as { url: string; key: string; name: string; customId: string | null }[];
}

const putFile = (url: string, bytes: Uint8Array, name: string) => {
  const form = new FormData();
  form.append("file", new File([new Uint8Array(bytes)], name, { type: "image/png" }));
  return fetch(url, { method: "PUT", headers: { range: "bytes=0-" }, body: form });
};

describe.each([
  { mode: "production: the fake POSTs the signed callback", app: () => prodApp, fake: () => configFake },
  { mode: "development: the fake streams the callback to the route handler", app: () => devApp, fake: () => envFake },
])("client upload of two images ($mode)", ({ app, fake }) => {
  it("runs onUploadComplete for both with the middleware metadata and serves the bytes back unchanged", async () => {
    const a = png("brake-chamber-left.png", 3000);
    const b = png("axle-hub-seal.png", 200_000);
    const progress = new Map<string, number>();
    const result = await uploaderFor(app()).uploadFiles("shopPhotos", {
      files: [a.file, b.file],
      headers: { "x-test-user": "tech-07" },
      onUploadProgress: (p) => progress.set(p.file.name, Math.max(progress.get(p.file.name) ?? 0, p.loaded)),
    });

    expect(result).toHaveLength(2);
    for (const [i, sent] of [a, b].entries()) {
      const res = result[i];
      if (!res) throw new Error("missing upload result");
      // The PUT answers only after onUploadComplete, carrying its return value (awaitServerData).
      expect(res.serverData).toEqual({ storedAs: res.key, shopId: "shop-0042" });
      expect(res.ufsUrl).toBe(`${fake().url}/f/${res.key}`);
      expect(res.fileHash).toBe(md5(sent.bytes));
      expect(progress.get(sent.file.name)).toBeGreaterThanOrEqual(sent.bytes.length);

      const got = received.find((r) => r.file.key === res.key);
      expect(got).toEqual({
        metadata: { shopId: "shop-0042", uploadedBy: "tech-07" },
        file: {
          key: res.key,
          name: sent.file.name,
          size: sent.bytes.length,
          type: "image/png",
          customId: null,
          ufsUrl: res.ufsUrl,
          fileHash: md5(sent.bytes),
        },
      });

      const download = await fetch(res.ufsUrl);
      expect(download.status).toBe(200);
      expect(download.headers.get("content-type")).toBe("image/png");
      expect(Buffer.from(await download.arrayBuffer()).equals(sent.bytes)).toBe(true);
    }
  });
});

describe("refusals", () => {
  it("refuses a presigned URL whose signed fields were altered (HMAC-SHA256 over the URL)", async () => {
    const [p] = await presign(prodApp, "shopPhotos", [{ name: "hub-seal.png", size: 10, type: "image/png" }]);
    if (!p) throw new Error("no presigned URL");
    const bigger = new URL(p.url);
    bigger.searchParams.set("x-ut-file-size", "99999999");
    const otherKey = new URL(p.url);
    otherKey.pathname = `/${p.key.slice(0, -1)}${p.key.endsWith("a") ? "b" : "a"}`;
    const forged = p.url.slice(0, -1) + (p.url.endsWith("0") ? "1" : "0");

    for (const url of [bigger.href, otherKey.href, forged]) {
      expect((await fetch(url, { method: "HEAD" })).status).toBe(403);
      const put = await putFile(url, randomBytes(10), "hub-seal.png");
      expect(put.status).toBe(403);
      expect(await put.json()).toEqual({ error: "Invalid signature" });
    }
    // The untouched URL is accepted: the refusals above come from the tampering alone.
    const head = await fetch(p.url, { method: "HEAD" });
    expect(head.status).toBe(200);
    expect(head.headers.get("x-ut-range-start")).toBe("0");
  });

  it("refuses bytes that differ from the signed size and reports it to onUploadError", async () => {
    const [p] = await presign(prodApp, "shopPhotos", [{ name: "drum.png", size: 10, type: "image/png" }]);
    if (!p) throw new Error("no presigned URL");
    const put = await putFile(p.url, randomBytes(20), "drum.png");
    expect(put.status).toBe(400);
    expect(uploadErrors).toContainEqual({ fileKey: p.key, message: expect.stringContaining(p.key) });
    expect((await fetch(`${configFake.url}/f/${p.key}`)).status).toBe(404);
    expect(received.some((r) => r.file.key === p.key)).toBe(false);
  });

  it("refuses an expired presigned URL, through the client and on a direct PUT", async () => {
    const a = png("expired.png", 100);
    await expect(uploaderFor(prodApp).uploadFiles("expiringPhotos", { files: [a.file] })).rejects.toMatchObject({
      code: "UPLOAD_FAILED",
    });
    const [p] = await presign(prodApp, "expiringPhotos", [{ name: "expired.png", size: 108, type: "image/png" }]);
    if (!p) throw new Error("no presigned URL");
    const put = await putFile(p.url, a.bytes, "expired.png");
    expect(put.status).toBe(403);
    expect(await put.json()).toEqual({ error: "Presigned URL has expired" });
  });

  it("lets the route handler's own limits refuse an oversize file and a ninth file before anything is signed", async () => {
    const utapi = new UTApi();
    const before = (await utapi.listFiles()).files.length;
    const big = new File([new Uint8Array(9 * 1024 * 1024)], "too-big.png", { type: "image/png" });
    await expect(uploaderFor(devApp).uploadFiles("shopPhotos", { files: [big] })).rejects.toMatchObject({
      code: "BAD_REQUEST",
      message: "Invalid config: FileSizeMismatch",
    });
    const nine = Array.from({ length: 9 }, (_, i) => png(`part-${i}.png`, 10).file);
    await expect(uploaderFor(devApp).uploadFiles("shopPhotos", { files: nine })).rejects.toMatchObject({
      code: "BAD_REQUEST",
      message: "Invalid config: FileCountMismatch",
    });
    expect((await utapi.listFiles()).files.length).toBe(before);
  });
});

describe("UTApi against the fake (configured by UPLOADTHING_* env)", () => {
  it("uploads server-side, lists, resolves URLs, signs private access and deletes", async () => {
    const utapi = new UTApi();
    const bytes = randomBytes(512);
    const up = await utapi.uploadFiles(new UTFile([bytes], "work-order-scan.pdf", { customId: "wo-1001" }), {
      acl: "private",
    });
    if (!up.data) throw new Error(`upload failed: ${JSON.stringify(up.error)}`);
    const { key, ufsUrl } = up.data;
    expect(existsSync(join(dirs[1] ?? "", key))).toBe(true);
    expect((await fetch(ufsUrl)).status).toBe(403); // private: needs a signed URL

    const listed = await utapi.listFiles();
    expect(listed.files).toContainEqual(expect.objectContaining({ key, customId: "wo-1001", size: 512, status: "Uploaded" }));
    expect((await utapi.getFileUrls(key)).data).toEqual([{ key, url: ufsUrl }]);

    const { ufsUrl: signed } = await utapi.generateSignedURL(key, { expiresIn: 60 });
    expect(signed).toMatch(new RegExp(`^http://localhost:\\d+/a/${envFake.appId}/${key}\\?expires=`));
    const viaSigned = await fetch(signed);
    expect(viaSigned.headers.get("content-type")).toBe("application/pdf");
    expect(Buffer.from(await viaSigned.arrayBuffer()).equals(bytes)).toBe(true);
    const access = await utapi.getSignedURL("wo-1001", { keyType: "customId" });
    expect((await fetch(access.ufsUrl)).status).toBe(200);
    expect((await fetch(`${signed.slice(0, -1)}${signed.endsWith("0") ? "1" : "0"}`)).status).toBe(403);

    expect(await utapi.deleteFiles(key)).toEqual({ success: true, deletedCount: 1 });
    expect((await fetch(signed)).status).toBe(404);
    expect((await utapi.listFiles()).files.some((x) => x.key === key)).toBe(false);
  });
});
