import type { IncomingMessage, ServerResponse } from "node:http";
import type { FakeContext } from "./context";
import { header, HttpError, readJsonObject, sendJson } from "./http-util";
import type { Registration } from "./registrations";
import { isValidKey } from "./store";

export function requireApiKey(req: IncomingMessage, ctx: FakeContext): void {
  if (header(req, "x-uploadthing-api-key") !== ctx.apiKey) throw new HttpError(401, "Invalid API key");
}

/**
 * POST /route-metadata from the route handler after it signs URLs:
 * { fileKeys, metadata, isDev, callbackUrl, callbackSlug, awaitServerData }.
 * isDev: answer with a JSON-lines stream that stays open until every file's hook is sent.
 */
export async function handleRouteMetadata(
  req: IncomingMessage,
  res: ServerResponse,
  ctx: FakeContext,
): Promise<void> {
  requireApiKey(req, ctx);
  const body = await readJsonObject(req);
  const { fileKeys, metadata, isDev, callbackUrl, callbackSlug, awaitServerData } = body;
  if (!Array.isArray(fileKeys) || !fileKeys.every((k): k is string => typeof k === "string" && isValidKey(k))) {
    throw new HttpError(400, "fileKeys must be an array of file keys");
  }
  if (typeof callbackUrl !== "string" || !URL.canParse(callbackUrl)) throw new HttpError(400, "callbackUrl must be a URL");
  if (typeof callbackSlug !== "string" || !callbackSlug) throw new HttpError(400, "callbackSlug is required");

  const reg: Registration = {
    fileKeys,
    metadata: metadata ?? {},
    isDev: isDev === true,
    callbackUrl,
    callbackSlug,
    awaitServerData: awaitServerData !== false,
    stream: null,
    open: new Set(fileKeys),
  };
  setTimeout(() => ctx.registrations.forget(reg), ctx.registrationTtlMs).unref();

  if (!reg.isDev) {
    ctx.registrations.add(reg);
    return sendJson(res, 200, { ok: true });
  }
  res.writeHead(200, { "content-type": "application/x-ndjson", "cache-control": "no-cache" });
  res.flushHeaders();
  reg.stream = res;
  res.on("close", () => {
    reg.stream = null;
  });
  ctx.registrations.add(reg);
  if (fileKeys.length === 0) ctx.registrations.forget(reg);
}

/**
 * POST /callback-result from the route handler once onUploadComplete returned:
 * { fileKey, callbackData } (or { fileKey, error } when it could not forward a dev callback).
 */
export async function handleCallbackResult(
  req: IncomingMessage,
  res: ServerResponse,
  ctx: FakeContext,
): Promise<void> {
  requireApiKey(req, ctx);
  const body = await readJsonObject(req);
  if (typeof body.fileKey !== "string") throw new HttpError(400, "fileKey is required");
  const outcome =
    typeof body.error === "string" ? { error: body.error } : { callbackData: body.callbackData ?? null };
  // The SDK posts a result even when the upload did not await one; nothing waits then.
  ctx.registrations.deliverResult(body.fileKey, outcome);
  sendJson(res, 200, { ok: true });
}
