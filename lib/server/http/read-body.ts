import "server-only";
import { HttpError } from "@/lib/http/problem";

export const DEFAULT_MAX_BODY_BYTES = 64 * 1024;

/** Reads a JSON request body, refusing oversize, non-JSON and malformed bodies with a 4xx. */
export async function readJsonBody(request: Request, maxBytes = DEFAULT_MAX_BODY_BYTES): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    throw new HttpError(415, "unsupported_media_type", "Unsupported media type", "Send the body as application/json.");
  }
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw tooLarge(maxBytes);
  const text = await readLimited(request, maxBytes);
  if (text.trim() === "") throw new HttpError(400, "malformed_json", "Malformed JSON", "The request body is empty.");
  try {
    return JSON.parse(text);
  } catch {
    throw new HttpError(400, "malformed_json", "Malformed JSON", "The request body is not valid JSON.");
  }
}

function tooLarge(maxBytes: number) {
  return new HttpError(413, "payload_too_large", "Payload too large", `The body may be at most ${maxBytes} bytes.`);
}

/** A stream's bytes, or null as soon as there are more than `maxBytes` (the rest is never read). */
export async function readUpTo(stream: ReadableStream<Uint8Array>, maxBytes: number): Promise<Buffer | null> {
  const reader = stream.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      return null;
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

async function readLimited(request: Request, maxBytes: number): Promise<string> {
  if (!request.body) return "";
  const bytes = await readUpTo(request.body, maxBytes);
  if (!bytes) throw tooLarge(maxBytes);
  return new TextDecoder().decode(bytes);
}

/** A text body of one of the given media types (a CSV file), size-checked while it streams. */
export async function readTextBody(request: Request, types: readonly string[], maxBytes: number): Promise<string> {
  const type = (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (!types.includes(type)) {
    throw new HttpError(415, "unsupported_media_type", "Unsupported media type", `Send the body as ${types.join(" or ")}.`);
  }
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw tooLarge(maxBytes);
  return readLimited(request, maxBytes);
}
