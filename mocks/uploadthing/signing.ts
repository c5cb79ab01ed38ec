import { createHmac, timingSafeEqual } from "node:crypto";

// Mirrors @uploadthing/shared crypto: HMAC-SHA256 keyed with the API key's UTF-8 bytes,
// hex digest, prefixed "hmac-sha256=".
const PREFIX = "hmac-sha256=";

export function signPayload(payload: string, apiKey: string): string {
  return PREFIX + createHmac("sha256", apiKey).update(payload, "utf8").digest("hex");
}

export function verifySignature(
  payload: string,
  signature: string | null | undefined,
  apiKey: string,
): boolean {
  if (!signature?.startsWith(PREFIX)) return false;
  const given = Buffer.from(signature.slice(PREFIX.length), "hex");
  const expected = createHmac("sha256", apiKey).update(payload, "utf8").digest();
  return given.length === expected.length && timingSafeEqual(given, expected);
}

/**
 * Same construction as the SDK's generateSignedURL: append expires (epoch ms), then each data
 * value URI-encoded once more before URLSearchParams encodes it, sign the whole href, and
 * append the signature last.
 */
export function signUrl(
  base: string,
  apiKey: string,
  ttlSeconds: number,
  data: Record<string, string | number | null | undefined> = {},
  now = Date.now(),
): string {
  const url = new URL(base);
  url.searchParams.append("expires", String(now + ttlSeconds * 1000));
  for (const [k, v] of Object.entries(data)) {
    if (v == null) continue;
    url.searchParams.append(k, encodeURIComponent(v));
  }
  url.searchParams.append("signature", signPayload(url.toString(), apiKey));
  return url.href;
}

export type SignedUrlCheck =
  | { ok: true; url: URL; params: SignedParams }
  | { ok: false; reason: string };

/** Values of the signed query, decoded back from the SDK's double encoding. */
export interface SignedParams {
  get(name: string): string | null;
}

/**
 * Checks a request target (path + query, as sent) against its signature. The signed text is the
 * absolute URL the SDK built, so it is rebuilt from the Host header the client sent.
 */
export function verifySignedUrl(
  requestTarget: string,
  host: string,
  apiKey: string,
  now = Date.now(),
): SignedUrlCheck {
  const marker = "&signature=";
  const at = requestTarget.lastIndexOf(marker);
  if (at < 0) return { ok: false, reason: "Missing signature" };
  const rawSignature = requestTarget.slice(at + marker.length);
  if (rawSignature.includes("&")) return { ok: false, reason: "Signature must be the last parameter" };
  let signature: string;
  try {
    signature = decodeURIComponent(rawSignature.replace(/\+/g, " "));
  } catch {
    return { ok: false, reason: "Malformed signature" };
  }
  const signedHref = `http://${host}${requestTarget.slice(0, at)}`;
  if (!verifySignature(signedHref, signature, apiKey)) return { ok: false, reason: "Invalid signature" };
  const url = new URL(signedHref);
  if (url.searchParams.getAll("expires").length !== 1) return { ok: false, reason: "Missing expiry" };
  const expires = Number(url.searchParams.get("expires"));
  if (!Number.isFinite(expires) || expires < now) return { ok: false, reason: "Presigned URL has expired" };
  const params: SignedParams = {
    get(name) {
      const raw = url.searchParams.get(name);
      if (raw == null) return null;
      try {
        return decodeURIComponent(raw);
      } catch {
        return raw;
      }
    },
  };
  return { ok: true, url, params };
}
