// Node has no XMLHttpRequest, and the UploadThing client PUTs files with one (to report upload
// progress). This is the smallest stand-in that client needs: open / setRequestHeader / send
// (FormData, Blob or string) / abort, responseType "json", upload "progress" events and
// "load" / "error" / "abort". It sends over node:http, so the fake sees a real request.
import { request as httpRequest, type ClientRequest } from "node:http";

type Listener = (event: { loaded: number; total: number }) => void;
const CHUNK_BYTES = 64 * 1024;

class Emitter {
  private readonly listeners = new Map<string, Listener[]>();
  addEventListener(type: string, fn: Listener): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), fn]);
  }
  removeEventListener(type: string, fn: Listener): void {
    this.listeners.set(type, (this.listeners.get(type) ?? []).filter((l) => l !== fn));
  }
  protected emit(type: string, loaded = 0, total = 0): void {
    for (const fn of this.listeners.get(type) ?? []) fn({ loaded, total });
  }
}

class UploadEmitter extends Emitter {
  progress(loaded: number, total: number): void {
    this.emit("progress", loaded, total);
  }
}

async function encode(body: unknown): Promise<{ bytes: Buffer; type: string | null }> {
  if (body == null) return { bytes: Buffer.alloc(0), type: null };
  if (typeof body === "string") return { bytes: Buffer.from(body), type: "text/plain;charset=UTF-8" };
  if (body instanceof FormData || body instanceof Blob) {
    const encoded = new Response(body);
    return { bytes: Buffer.from(await encoded.arrayBuffer()), type: encoded.headers.get("content-type") };
  }
  throw new TypeError("NodeXhr only sends FormData, Blob or string bodies");
}

export class NodeXhr extends Emitter {
  readonly upload = new UploadEmitter();
  responseType: "" | "json" | "text" = "";
  response: unknown = null;
  responseText = "";
  status = 0;
  statusText = "";
  readyState = 0;
  private method = "GET";
  private url = "";
  private readonly headers: Record<string, string> = {};
  private req: ClientRequest | null = null;
  private aborted = false;
  private answered = false;

  open(method: string, url: string | URL): void {
    this.method = method.toUpperCase();
    this.url = String(url);
    this.readyState = 1;
  }

  setRequestHeader(name: string, value: string): void {
    this.headers[name.toLowerCase()] = value;
  }

  send(body?: unknown): void {
    this.start(body).catch(() => this.fail());
  }

  abort(): void {
    this.aborted = true;
    this.req?.destroy();
    this.emit("abort");
  }

  private fail(): void {
    if (this.aborted || this.answered) return;
    this.answered = true;
    this.readyState = 4;
    this.emit("error");
  }

  private async start(body: unknown): Promise<void> {
    const { bytes, type } = await encode(body);
    const headers: Record<string, string> = { ...this.headers, "content-length": String(bytes.length) };
    if (type && !headers["content-type"]) headers["content-type"] = type;
    const req = httpRequest(this.url, { method: this.method, headers });
    this.req = req;
    req.on("error", () => this.fail());
    req.on("response", (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("error", () => this.fail());
      res.on("end", () => {
        if (this.aborted) return;
        this.answered = true;
        this.status = res.statusCode ?? 0;
        this.statusText = res.statusMessage ?? "";
        this.responseText = Buffer.concat(chunks).toString("utf8");
        this.response = this.responseType === "json" ? parseJson(this.responseText) : this.responseText;
        this.readyState = 4;
        this.emit("load");
        this.emit("loadend");
      });
    });
    let loaded = 0;
    for (let at = 0; at < bytes.length && !this.answered && !this.aborted; at += CHUNK_BYTES) {
      const part = bytes.subarray(at, at + CHUNK_BYTES);
      const written = await new Promise<boolean>((resolve) => req.write(part, (err) => resolve(!err)));
      if (!written) return;
      loaded += part.length;
      this.upload.progress(loaded, bytes.length);
    }
    req.end();
  }
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

export function installNodeXhr(): () => void {
  const had = Object.hasOwn(globalThis, "XMLHttpRequest");
  const previous: unknown = Reflect.get(globalThis, "XMLHttpRequest");
  Reflect.set(globalThis, "XMLHttpRequest", NodeXhr);
  return () => {
    if (had) Reflect.set(globalThis, "XMLHttpRequest", previous);
    else Reflect.deleteProperty(globalThis, "XMLHttpRequest");
  };
}
