import type { Registration } from "./registrations";
import { signPayload } from "./signing";
import type { StoredFile } from "./store";

export type Hook = "callback" | "error";

export interface FileUrls {
  url: string;
  appUrl: string;
  ufsUrl: string;
}

export function fileUrls(publicUrl: string, appId: string, key: string): FileUrls {
  return {
    url: `${publicUrl}/f/${key}`,
    appUrl: `${publicUrl}/a/${appId}/${key}`,
    ufsUrl: `${publicUrl}/f/${key}`,
  };
}

/**
 * Body the route handler's callback branch decodes: { status, file: UploadedFileData, origin,
 * metadata }. It then POSTs onUploadComplete's result to `${origin}/callback-result`.
 */
export function callbackPayload(
  file: StoredFile,
  urls: FileUrls,
  metadata: unknown,
  origin: string,
): string {
  return JSON.stringify({
    status: "uploaded",
    metadata: metadata ?? {},
    file: {
      name: file.name,
      size: file.size,
      type: file.type,
      customId: file.customId,
      key: file.key,
      url: urls.url,
      appUrl: urls.appUrl,
      ufsUrl: urls.ufsUrl,
      fileHash: file.fileHash,
    },
    origin,
  });
}

/** Body the route handler's error branch decodes: { fileKey, error }; it runs onUploadError. */
export function errorPayload(fileKey: string, error: string): string {
  return JSON.stringify({ fileKey, error });
}

export type Delivery = { ok: true } | { ok: false; reason: string };

/**
 * In dev mode the hook goes down the open /route-metadata stream as one JSON line
 * { payload, signature, hook } and the route handler replays it against itself; otherwise it is
 * POSTed to callbackUrl?slug=… with the uploadthing-hook and x-uploadthing-signature headers.
 */
export async function deliverHook(
  reg: Registration,
  hook: Hook,
  payload: string,
  apiKey: string,
  timeoutMs: number,
): Promise<Delivery> {
  const signature = signPayload(payload, apiKey);
  if (reg.isDev) {
    if (!reg.stream || reg.stream.writableEnded) {
      return { ok: false, reason: "The app's dev stream for this upload is closed" };
    }
    reg.stream.write(`${JSON.stringify({ payload, signature, hook })}\n`);
    return { ok: true };
  }
  const target = new URL(reg.callbackUrl);
  target.searchParams.set("slug", reg.callbackSlug);
  try {
    const res = await fetch(target, {
      method: "POST",
      headers: {
        "content-type": "application/json",
        "uploadthing-hook": hook,
        "x-uploadthing-signature": signature,
      },
      body: payload,
      signal: AbortSignal.timeout(timeoutMs),
    });
    await res.arrayBuffer();
    return res.ok ? { ok: true } : { ok: false, reason: `Callback to the app answered ${res.status}` };
  } catch (err) {
    return { ok: false, reason: `Callback to the app failed: ${(err as Error).message}` };
  }
}
