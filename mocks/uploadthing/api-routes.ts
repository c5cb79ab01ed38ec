import type { IncomingMessage, ServerResponse } from "node:http";
import { fileUrls } from "./callback";
import type { FakeContext } from "./context";
import { HttpError, readJsonObject, sendJson } from "./http-util";
import { requireApiKey } from "./registration-routes";
import { signUrl } from "./signing";

type Body = Record<string, unknown>;
type Route = (body: Body, ctx: FakeContext) => Promise<unknown>;

const USAGE_LIMIT_BYTES = 2 * 1024 * 1024 * 1024;

/** Keys named by `{ fileKeys: [...] }` or `{ customIds: [...] }` (UTApi's keyType option). */
async function keysFrom(body: Body, ctx: FakeContext): Promise<string[]> {
  const refs = Array.isArray(body.fileKeys)
    ? body.fileKeys.map((fileKey: unknown) => ({ fileKey }))
    : Array.isArray(body.customIds)
      ? body.customIds.map((customId: unknown) => ({ customId }))
      : null;
  if (!refs) throw new HttpError(400, "Expected fileKeys or customIds");
  const keys: string[] = [];
  for (const ref of refs) {
    const key = await ctx.store.resolve(ref);
    if (key) keys.push(key);
  }
  return keys;
}

function updatesFrom(body: Body): Body[] {
  if (!Array.isArray(body.updates)) throw new HttpError(400, "Expected updates");
  return body.updates.filter((u: unknown): u is Body => typeof u === "object" && u !== null);
}

// Request and response shapes follow UTApi in uploadthing/server (sdk/index).
const routes: Record<string, Route> = {
  "/v6/deleteFiles": async (body, ctx) => {
    let deletedCount = 0;
    for (const key of await keysFrom(body, ctx)) if (await ctx.store.remove(key)) deletedCount++;
    return { success: true, deletedCount };
  },
  "/v6/getFileUrl": async (body, ctx) => ({
    data: (await keysFrom(body, ctx)).map((key) => ({ key, url: fileUrls(ctx.publicUrl, ctx.appId, key).ufsUrl })),
  }),
  "/v6/listFiles": async (body, ctx) => {
    const all = await ctx.store.list();
    const offset = typeof body.offset === "number" ? body.offset : 0;
    const limit = typeof body.limit === "number" ? body.limit : 500;
    const page = all.slice(offset, offset + limit);
    return {
      hasMore: offset + page.length < all.length,
      files: page.map((f) => ({
        id: f.key,
        customId: f.customId,
        key: f.key,
        name: f.name,
        size: f.size,
        status: "Uploaded",
        uploadedAt: f.uploadedAt,
      })),
    };
  },
  "/v6/renameFiles": async (body, ctx) => {
    for (const u of updatesFrom(body)) {
      const key = await ctx.store.resolve(u);
      if (key && typeof u.newName === "string") await ctx.store.update(key, { name: u.newName });
    }
    return { success: true };
  },
  "/v6/updateACL": async (body, ctx) => {
    for (const u of updatesFrom(body)) {
      const key = await ctx.store.resolve(u);
      if (key && (u.acl === "private" || u.acl === "public-read")) await ctx.store.update(key, { acl: u.acl });
    }
    return { success: true };
  },
  "/v6/getUsageInfo": async (_body, ctx) => {
    const total = await ctx.store.totalBytes();
    return {
      totalBytes: total,
      appTotalBytes: total,
      filesUploaded: (await ctx.store.list()).length,
      limitBytes: USAGE_LIMIT_BYTES,
    };
  },
  "/v6/requestFileAccess": async (body, ctx) => {
    const key = await ctx.store.resolve(body);
    if (!key) throw new HttpError(404, "File not found");
    const ttl = typeof body.expiresIn === "number" ? body.expiresIn : 3600;
    const url = signUrl(fileUrls(ctx.publicUrl, ctx.appId, key).ufsUrl, ctx.apiKey, ttl);
    return { url, ufsUrl: url };
  },
};

export function isApiRoute(pathname: string): boolean {
  return Object.hasOwn(routes, pathname);
}

export async function handleApi(
  req: IncomingMessage,
  res: ServerResponse,
  ctx: FakeContext,
  pathname: string,
): Promise<void> {
  const route = routes[pathname];
  if (!route) throw new HttpError(404, "Unknown API route");
  requireApiKey(req, ctx);
  sendJson(res, 200, await route(await readJsonObject(req), ctx));
}
