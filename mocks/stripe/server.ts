import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { ApiRoutes } from "./api-routes";
import { Checkout } from "./checkout";
import { handleControl } from "./control-routes";
import { sendHtml } from "./http-util";
import { noticePage } from "./page";
import { handlePage } from "./page-routes";
import { FakeStore } from "./store";
import type { DeliveryRecord, FakeEvent, FakeEventType, FakeStripeOptions, SessionRecord } from "./types";
import { WebhookDispatcher } from "./webhooks";

export type { FakeStripeOptions } from "./types";
export { signatureHeader } from "./webhooks";
export { DECLINED_MESSAGE, TEST_CARDS, USE_TEST_CARD_MESSAGE } from "./page-routes";

export interface FakeStripe {
  /** Base URL of the fake, e.g. http://127.0.0.1:12111 (API, hosted page and /_fake). */
  url: string;
  port: number;
  /** Options for `new Stripe(key, sdkConfig)`. */
  sdkConfig: { host: string; port: number; protocol: "http" };
  events(): FakeEvent[];
  deliveries(): DeliveryRecord[];
  session(id: string): SessionRecord | undefined;
  /** Resolves once no webhook attempt is in flight or waiting for a retry. */
  whenDeliveriesSettled(): Promise<void>;
  reset(): void;
  close(): Promise<void>;
}

// Real retries in test mode run over hours; a local fake keeps the same rising shape but shorter.
const DEFAULT_RETRY_DELAYS_MS = [5_000, 30_000, 120_000, 600_000];
const DEFAULT_EVENTS: FakeEventType[] = ["checkout.session.completed", "checkout.session.expired"];

export async function startFakeStripe(options: FakeStripeOptions): Promise<FakeStripe> {
  const host = options.host ?? "127.0.0.1";
  const log = options.log ?? (() => {});
  const apiVersion = options.apiVersion ?? Stripe.API_VERSION;
  const store = new FakeStore(options.stateFile);
  const webhooks = new WebhookDispatcher(store, {
    url: options.webhookUrl,
    secret: options.webhookSecret,
    retryDelaysMs: options.retryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS,
    timeoutMs: options.deliveryTimeoutMs ?? 10_000,
    log,
  });
  let baseUrl = "";
  const checkout = new Checkout(store, webhooks, {
    pageBaseUrl: () => options.publicUrl?.replace(/\/$/, "") ?? baseUrl,
    apiVersion,
    enabledEvents: options.enabledEvents ?? DEFAULT_EVENTS,
  });
  const api = new ApiRoutes(store, checkout, apiVersion);
  const reset = (): void => {
    webhooks.cancelAll();
    store.reset();
  };

  const server = createServer((req, res) => {
    route(req, res).catch((err: unknown) => {
      log(`fake payments: ${err instanceof Error ? err.stack : String(err)}`);
      if (!res.headersSent) sendHtml(res, 500, noticePage("Local fake error", "The local test payment service failed."));
      else res.end();
    });
  });

  async function route(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", "http://fake.invalid");
    log(`${req.method} ${url.pathname}`);
    if (url.pathname.startsWith("/v1/")) return api.handle(req, res, url);
    if (url.pathname.startsWith("/_fake/")) return handleControl(req, res, url, { store, checkout, webhooks, onReset: reset });
    const pay = /^\/pay\/([^/]+)$/.exec(url.pathname);
    if (pay && (req.method === "GET" || req.method === "POST")) {
      return handlePage(req, res, checkout, decodeURIComponent(pay[1] ?? ""));
    }
    sendHtml(res, 404, noticePage("Not found", "Nothing lives at this address on the local test payment service."));
  }

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, host, () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  baseUrl = `http://${host.includes(":") ? `[${host}]` : host}:${port}`;

  const sweep = setInterval(() => checkout.sweepExpired(), options.expirySweepMs ?? 30_000);
  sweep.unref();

  return {
    url: baseUrl,
    port,
    sdkConfig: { host, port, protocol: "http" },
    events: () => store.events.map((e) => e.event),
    deliveries: () => [...store.deliveries],
    session: (id) => checkout.find(id),
    whenDeliveriesSettled: () => webhooks.whenIdle(),
    reset,
    close: async () => {
      clearInterval(sweep);
      webhooks.close();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        // The SDK keeps sockets alive (esm/net/NodeHttpClient.js default agents); drop them.
        server.closeAllConnections();
      });
    },
  };
}
