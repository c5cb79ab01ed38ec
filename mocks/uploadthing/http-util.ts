import type { IncomingMessage, ServerResponse } from "node:http";

export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export async function readBody(req: IncomingMessage, limitBytes: number): Promise<Buffer> {
  const declared = Number(req.headers["content-length"] ?? "0");
  if (declared > limitBytes) throw new HttpError(413, "Request body is larger than the file allows");
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of req) {
    const buf = Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk as Uint8Array);
    total += buf.length;
    if (total > limitBytes) throw new HttpError(413, "Request body is larger than the file allows");
    chunks.push(buf);
  }
  return Buffer.concat(chunks);
}

export async function readJsonObject(req: IncomingMessage): Promise<Record<string, unknown>> {
  const text = (await readBody(req, 1024 * 1024)).toString("utf8");
  let parsed: unknown;
  try {
    parsed = text.length ? JSON.parse(text) : {};
  } catch {
    throw new HttpError(400, "Body is not JSON");
  }
  if (typeof parsed !== "object" || parsed === null || Array.isArray(parsed)) {
    throw new HttpError(400, "Body must be a JSON object");
  }
  return parsed as Record<string, unknown>;
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  const text = JSON.stringify(body);
  res.writeHead(status, {
    "content-type": "application/json",
    "content-length": String(Buffer.byteLength(text)),
    ...headers,
  });
  res.end(text);
}

// The browser uploads straight to the ingest host from the app's origin, so every response
// carries CORS headers and preflights are answered.
export function applyCors(req: IncomingMessage, res: ServerResponse): void {
  res.setHeader("access-control-allow-origin", "*");
  res.setHeader("access-control-expose-headers", "x-ut-range-start, content-disposition, content-length");
  if (req.method === "OPTIONS") {
    res.setHeader("access-control-allow-methods", "GET, HEAD, PUT, POST, OPTIONS");
    res.setHeader(
      "access-control-allow-headers",
      req.headers["access-control-request-headers"] ?? "content-type, range, x-uploadthing-version, b3, traceparent",
    );
    res.setHeader("access-control-max-age", "600");
  }
}

export function header(req: IncomingMessage, name: string): string | undefined {
  const v = req.headers[name.toLowerCase()];
  return Array.isArray(v) ? v[0] : v;
}
