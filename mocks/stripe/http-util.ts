import type { IncomingMessage, ServerResponse } from "node:http";

const MAX_BODY = 1024 * 1024;

export function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on("data", (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY) {
        reject(new Error("request body too large"));
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

export function sendJson(res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  const text = JSON.stringify(body, null, 2);
  res.writeHead(status, {
    "Content-Type": "application/json",
    "Cache-Control": "no-cache, no-store",
    "Content-Length": Buffer.byteLength(text),
    ...headers,
  });
  res.end(text);
}

export function sendRaw(res: ServerResponse, status: number, text: string, headers: Record<string, string>): void {
  res.writeHead(status, { "Content-Length": Buffer.byteLength(text), ...headers });
  res.end(text);
}

export function sendHtml(res: ServerResponse, status: number, html: string): void {
  sendRaw(res, status, html, {
    "Content-Type": "text/html; charset=utf-8",
    "Cache-Control": "no-store",
    // The page has no scripts; only its own inline style and same-origin form posts.
    "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; form-action 'self' http: https:",
    "Referrer-Policy": "no-referrer",
  });
}

export function redirect(res: ServerResponse, location: string): void {
  res.writeHead(303, { Location: location, "Content-Length": 0, "Cache-Control": "no-store" });
  res.end();
}

export function headerValue(req: IncomingMessage, name: string): string | undefined {
  const v = req.headers[name.toLowerCase()];
  return Array.isArray(v) ? v[0] : v;
}
