import type { IncomingMessage, ServerResponse } from "node:http";
import type { FakeContext } from "./context";
import { header, sendJson } from "./http-util";
import { verifySignedUrl } from "./signing";
import type { StoredFile } from "./store";

/**
 * GET/HEAD /f/<key> (ufsUrl and the old url) and /a/<appId>/<key> (appUrl and
 * UTApi.generateSignedURL with ufsAppIdLocation "path"). Returns the key, or null if the path
 * is not a file path.
 */
export function fileKeyFromPath(pathname: string, appId: string): string | null {
  const parts = pathname.split("/").filter(Boolean);
  if (parts.length === 2 && parts[0] === "f") return parts[1] ?? null;
  if (parts.length === 3 && parts[0] === "a" && parts[1] === appId) return parts[2] ?? null;
  return null;
}

export async function handleFile(
  req: IncomingMessage,
  res: ServerResponse,
  ctx: FakeContext,
  key: string,
): Promise<void> {
  const file = await ctx.store.get(key);
  if (!file) return sendJson(res, 404, { error: "File not found" });
  const target = req.url ?? "/";
  const signed = target.includes("signature=");
  // Private files need a signed, unexpired URL; a signature on a public file must still be valid.
  if (file.acl === "private" || signed) {
    const check = verifySignedUrl(target, header(req, "host") ?? "", ctx.apiKey);
    if (!check.ok) return sendJson(res, 403, { error: check.reason });
  }
  const bytes = await ctx.store.read(key);
  res.writeHead(200, {
    "content-type": file.type,
    "content-length": String(bytes.length),
    "content-disposition": disposition(file),
    "cache-control": file.acl === "private" ? "private, no-store" : "no-cache",
    etag: `"${file.fileHash}"`,
  });
  res.end(req.method === "HEAD" ? undefined : bytes);
}

function disposition(file: StoredFile): string {
  const ascii = file.name.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return `${file.contentDisposition}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(file.name)}`;
}
