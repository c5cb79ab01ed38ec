import type { IncomingMessage, ServerResponse } from "node:http";
import type { Checkout } from "./checkout";
import { ApiError, noSuch } from "./errors";
import { sendJson } from "./http-util";
import type { FakeStore } from "./store";
import type { WebhookDispatcher } from "./webhooks";

/**
 * Fake-only controls under /_fake/ (nothing like them exists on the real
 * service): inspect events and deliveries, drive sessions without a browser,
 * resend an event, reset state. JSON in and out; errors use the API's shape.
 */
export async function handleControl(
  req: IncomingMessage,
  res: ServerResponse,
  url: URL,
  deps: { store: FakeStore; checkout: Checkout; webhooks: WebhookDispatcher; onReset: () => void },
): Promise<void> {
  const { store, checkout, webhooks } = deps;
  const method = req.method ?? "GET";
  const path = url.pathname.replace(/^\/_fake/, "");
  let m: RegExpExecArray | null;
  try {
    if (method === "GET" && path === "/health") return sendJson(res, 200, { ok: true });
    if (method === "GET" && path === "/events") {
      const type = url.searchParams.get("type");
      const data = store.events.map((e) => e.event).filter((e) => !type || e.type === type);
      return sendJson(res, 200, { object: "list", data });
    }
    if (method === "GET" && (m = /^\/events\/([^/]+)$/.exec(path))) {
      const record = store.findEvent(m[1] ?? "");
      if (!record) throw noSuch("event", m[1] ?? "", "id");
      return sendJson(res, 200, record.event);
    }
    if (method === "POST" && (m = /^\/events\/([^/]+)\/redeliver$/.exec(path))) {
      const record = store.findEvent(m[1] ?? "");
      if (!record) throw noSuch("event", m[1] ?? "", "id");
      if (!webhooks.enabled) throw new ApiError(400, "invalid_request_error", "No webhookUrl is configured.");
      return sendJson(res, 200, { delivery: await webhooks.redeliver(record) });
    }
    if (method === "GET" && path === "/deliveries") {
      const event = url.searchParams.get("event");
      return sendJson(res, 200, { object: "list", data: store.deliveries.filter((d) => !event || d.event_id === event) });
    }
    if (method === "GET" && path === "/checkout/sessions") {
      return sendJson(res, 200, { object: "list", data: [...store.sessions.keys()].map((id) => checkout.get(id).session) });
    }
    if (method === "POST" && (m = /^\/checkout\/sessions\/([^/]+)\/(complete|decline)$/.exec(path))) {
      const record = checkout.get(m[1] ?? "");
      if (record.session.status !== "open") {
        throw new ApiError(400, "invalid_request_error", `The session is ${record.session.status}, not open.`, undefined, "session");
      }
      const outcome = checkout.pay(record, m[2] === "complete" ? "approve" : "decline");
      const body = outcome.kind === "paid"
        ? { session: record.session, redirect_to: outcome.redirectTo }
        : { session: record.session, declined: true, declined_attempts: record.declinedAttempts };
      return sendJson(res, 200, body);
    }
    if (method === "POST" && path === "/reset") {
      deps.onReset();
      return sendJson(res, 200, { ok: true });
    }
    sendJson(res, 404, new ApiError(404, "invalid_request_error", `No fake control at ${method} ${url.pathname}`).toBody());
  } catch (err) {
    const e = err instanceof ApiError ? err : new ApiError(500, "api_error", err instanceof Error ? err.message : String(err));
    sendJson(res, e.status, e.toBody());
  }
}
