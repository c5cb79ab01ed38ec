import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { handleApi, isApiRoute } from "./api-routes";
import type { FakeContext } from "./context";
import { fileKeyFromPath, handleFile } from "./files-route";
import { applyCors, HttpError, sendJson } from "./http-util";
import { handleIngest } from "./ingest";
import { handleCallbackResult, handleRouteMetadata } from "./registration-routes";
import { Registrations } from "./registrations";
import { FileStore, isValidKey } from "./store";
import { DEFAULT_FAKE_API_KEY, DEFAULT_FAKE_APP_ID, fakeUploadThingEnv, makeFakeToken } from "@/lib/uploads/fake-token";

export interface FakeUploadThingOptions {
  /** 0 picks a free port. */
  port: number;
  storageDir: string;
  appId?: string;
  apiKey?: string;
  /** Loopback address to bind; default 127.0.0.1. */
  host?: string;
  callbackTimeoutMs?: number;
  registrationTimeoutMs?: number;
  registrationTtlMs?: number;
  /** Where warnings go; default console.warn. */
  onWarning?: (message: string) => void;
}

export interface FakeUploadThing {
  /** Ingest, API and file origin, e.g. http://127.0.0.1:12112 */
  url: string;
  /** A well-formed UPLOADTHING_TOKEN for this fake. */
  token: string;
  appId: string;
  apiKey: string;
  /** The UPLOADTHING_* variables an app sets to use this fake. */
  env: Record<string, string>;
  close(): Promise<void>;
}

export async function startFakeUploadThing(opts: FakeUploadThingOptions): Promise<FakeUploadThing> {
  const host = opts.host ?? "127.0.0.1";
  const store = new FileStore(opts.storageDir);
  await store.init();
  const registrations = new Registrations();
  const warn = opts.onWarning ?? ((m: string) => console.warn(`[fake-uploadthing] ${m}`));
  const ctx: FakeContext = {
    store,
    registrations,
    apiKey: opts.apiKey ?? DEFAULT_FAKE_API_KEY,
    appId: opts.appId ?? DEFAULT_FAKE_APP_ID,
    publicUrl: "",
    callbackTimeoutMs: opts.callbackTimeoutMs ?? 30_000,
    registrationTimeoutMs: opts.registrationTimeoutMs ?? 10_000,
    registrationTtlMs: opts.registrationTtlMs ?? 60 * 60 * 1000,
    warn,
  };

  const server = createServer((req, res) => {
    dispatch(req, res, ctx).catch((err: unknown) => {
      const status = err instanceof HttpError ? err.status : 500;
      if (status === 500) warn(`${req.method} ${req.url}: ${(err as Error).stack ?? String(err)}`);
      req.resume();
      if (res.headersSent) res.destroy();
      else sendJson(res, status, { error: (err as Error).message });
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, host, () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  ctx.publicUrl = `http://${host}:${port}`;
  const token = makeFakeToken({ baseUrl: ctx.publicUrl, appId: ctx.appId, apiKey: ctx.apiKey });

  return {
    url: ctx.publicUrl,
    token,
    appId: ctx.appId,
    apiKey: ctx.apiKey,
    env: fakeUploadThingEnv(ctx.publicUrl, token),
    close: async () => {
      registrations.closeAll();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

async function dispatch(req: IncomingMessage, res: ServerResponse, ctx: FakeContext): Promise<void> {
  applyCors(req, res);
  const method = req.method ?? "GET";
  if (method === "OPTIONS") {
    res.writeHead(204);
    res.end();
    return;
  }
  const { pathname } = new URL(req.url ?? "/", "http://fake.invalid");

  if (method === "POST") {
    if (pathname === "/route-metadata") return handleRouteMetadata(req, res, ctx);
    if (pathname === "/callback-result") return handleCallbackResult(req, res, ctx);
    if (isApiRoute(pathname)) return handleApi(req, res, ctx, pathname);
  }
  if (method === "GET" || method === "HEAD") {
    const fileKey = fileKeyFromPath(pathname, ctx.appId);
    if (fileKey !== null) return handleFile(req, res, ctx, fileKey);
    if (pathname === "/" && method === "GET") {
      return sendJson(res, 200, { service: "fake-uploadthing", appId: ctx.appId });
    }
  }
  const ingestKey = pathname.slice(1);
  if ((method === "PUT" || method === "HEAD") && isValidKey(ingestKey)) {
    return handleIngest(req, res, ctx, ingestKey);
  }
  throw new HttpError(404, `No route for ${method} ${pathname}`);
}
