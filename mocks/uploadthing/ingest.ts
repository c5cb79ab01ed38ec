import { createHash } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import { callbackPayload, deliverHook, errorPayload, fileUrls, type FileUrls } from "./callback";
import type { FakeContext } from "./context";
import { header, HttpError, readBody, sendJson } from "./http-util";
import type { Registration } from "./registrations";
import { verifySignedUrl, type SignedParams } from "./signing";
import type { Acl, ContentDisposition, StoredFile } from "./store";

// Room for the multipart envelope around the file's bytes.
const MULTIPART_ALLOWANCE = 64 * 1024;

/** HEAD and PUT on a presigned URL `<ingest>/<key>?expires=…&x-ut-…&signature=…`. */
export async function handleIngest(
  req: IncomingMessage,
  res: ServerResponse,
  ctx: FakeContext,
  key: string,
): Promise<void> {
  const check = verifySignedUrl(req.url ?? "/", header(req, "host") ?? "", ctx.apiKey);
  if (!check.ok) return refuse(req, res, 403, check.reason);
  const params = check.params;
  if (params.get("x-ut-identifier") !== ctx.appId) return refuse(req, res, 403, "Presigned URL is for another app");
  const declaredSize = Number(params.get("x-ut-file-size"));
  if (!Number.isSafeInteger(declaredSize) || declaredSize < 0) {
    return refuse(req, res, 400, "Presigned URL has no valid x-ut-file-size");
  }
  const existing = await ctx.store.get(key);

  if (req.method === "HEAD") {
    // Bytes already held; the client resumes from here. The fake keeps no partial uploads.
    res.writeHead(200, { "x-ut-range-start": existing ? String(existing.size) : "0", "content-length": "0" });
    res.end();
    return;
  }

  if (existing) {
    req.resume();
    return sendJson(res, 200, putResult(fileUrls(ctx.publicUrl, ctx.appId, key), existing, existing.serverData));
  }
  if (rangeStart(header(req, "range")) !== 0) {
    return refuse(req, res, 416, "No partial upload is held for this file; start from byte 0");
  }

  const slug = params.get("x-ut-slug");
  const reg = slug ? await ctx.registrations.find(key, ctx.registrationTimeoutMs) : undefined;
  if (slug && !reg) return refuse(req, res, 400, "This upload was never registered with /route-metadata");
  if (reg && reg.callbackSlug !== slug) return refuse(req, res, 403, "Presigned URL slug does not match its registration");

  const body = await readBody(req, declaredSize + MULTIPART_ALLOWANCE);
  const { bytes, blobType } = await extractFile(body, header(req, "content-type"));
  if (bytes.length !== declaredSize) {
    const reason = `Received ${bytes.length} bytes but the presigned URL allows exactly ${declaredSize}`;
    if (reg) await failRegistered(ctx, reg, key, reason);
    return sendJson(res, 400, { error: reason });
  }

  const file = describe(key, params, bytes, blobType);
  await ctx.store.save(file, bytes);
  const urls = fileUrls(ctx.publicUrl, ctx.appId, key);
  // Server-side uploads (UTApi.uploadFiles) carry no slug: no registration, no callback.
  if (!reg) return sendJson(res, 200, putResult(urls, file, undefined));
  await completeRegistered(res, ctx, reg, file, urls);
}

async function completeRegistered(
  res: ServerResponse,
  ctx: FakeContext,
  reg: Registration,
  file: StoredFile,
  urls: FileUrls,
): Promise<void> {
  const payload = callbackPayload(file, urls, reg.metadata, ctx.publicUrl);
  if (!reg.awaitServerData) {
    sendJson(res, 200, putResult(urls, file, null));
    const delivery = await deliverHook(reg, "callback", payload, ctx.apiKey, ctx.callbackTimeoutMs);
    if (!delivery.ok) ctx.warn(`${file.key}: ${delivery.reason}`);
    ctx.registrations.finish(file.key);
    return;
  }
  const result = ctx.registrations.expectResult(file.key, ctx.callbackTimeoutMs);
  const delivery = await deliverHook(reg, "callback", payload, ctx.apiKey, ctx.callbackTimeoutMs);
  ctx.registrations.finish(file.key);
  if (!delivery.ok) {
    ctx.registrations.deliverResult(file.key, { error: delivery.reason });
    return sendJson(res, 500, { error: delivery.reason });
  }
  const outcome = await result;
  if (!outcome) return sendJson(res, 500, { error: "Timed out waiting for the app's onUploadComplete result" });
  if ("error" in outcome) return sendJson(res, 500, { error: outcome.error });
  await ctx.store.update(file.key, { serverData: outcome.callbackData });
  sendJson(res, 200, putResult(urls, file, outcome.callbackData));
}

async function failRegistered(ctx: FakeContext, reg: Registration, key: string, reason: string): Promise<void> {
  const delivery = await deliverHook(reg, "error", errorPayload(key, reason), ctx.apiKey, ctx.callbackTimeoutMs);
  if (!delivery.ok) ctx.warn(`${key}: ${delivery.reason}`);
  ctx.registrations.finish(key);
}

/** The JSON the client's XHR resolves with: { url, appUrl, ufsUrl, fileHash, serverData }. */
function putResult(urls: FileUrls, file: StoredFile, serverData: unknown): Record<string, unknown> {
  const base: Record<string, unknown> = { ...urls, fileHash: file.fileHash };
  return serverData === undefined ? base : { ...base, serverData };
}

function describe(key: string, params: SignedParams, bytes: Buffer, blobType: string | null): StoredFile {
  const disposition = params.get("x-ut-content-disposition");
  const acl = params.get("x-ut-acl");
  return {
    key,
    name: params.get("x-ut-file-name") ?? key,
    size: bytes.length,
    type: params.get("x-ut-file-type") || blobType || "application/octet-stream",
    customId: params.get("x-ut-custom-id"),
    acl: (acl === "private" ? "private" : "public-read") satisfies Acl,
    contentDisposition: (disposition === "attachment" ? "attachment" : "inline") satisfies ContentDisposition,
    fileHash: createHash("md5").update(bytes).digest("hex"),
    uploadedAt: Date.now(),
    slug: params.get("x-ut-slug"),
  };
}

/** The SDK sends multipart form data with one field "file"; a raw body is accepted too. */
async function extractFile(
  body: Buffer,
  contentType: string | undefined,
): Promise<{ bytes: Buffer; blobType: string | null }> {
  if (!contentType?.toLowerCase().startsWith("multipart/form-data")) return { bytes: body, blobType: null };
  let form: FormData;
  try {
    form = await new Response(new Blob([new Uint8Array(body)]), { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new HttpError(400, "Malformed multipart body");
  }
  const file = form.get("file");
  if (!(file instanceof Blob)) throw new HttpError(400, 'Multipart body has no "file" field');
  return { bytes: Buffer.from(await file.arrayBuffer()), blobType: file.type || null };
}

function rangeStart(range: string | undefined): number {
  if (!range) return 0;
  const m = /^bytes=(\d+)-$/.exec(range.trim());
  return m?.[1] ? Number(m[1]) : -1;
}

function refuse(req: IncomingMessage, res: ServerResponse, status: number, reason: string): void {
  req.resume();
  if (req.method === "HEAD") {
    res.writeHead(status, { "content-length": "0" });
    res.end();
    return;
  }
  sendJson(res, status, { error: reason });
}
