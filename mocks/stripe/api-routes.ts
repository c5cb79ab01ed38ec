import { createHash } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Checkout } from "./checkout";
import { parseCreateSession, parseExpand } from "./checkout-params";
import { ApiError, invalidParam, noSuch, unrecognizedUrl } from "./errors";
import { FormShapeError, parseForm, type FormObject } from "./form";
import { headerValue, readBody, sendJson, sendRaw } from "./http-util";
import { lineItemsList, type EventRequest } from "./objects";
import { randomId, type FakeStore } from "./store";
import type { SessionRecord } from "./types";

interface ApiContext {
  method: string;
  path: string;
  params: FormObject;
  request: EventRequest;
}

type Handler = (ctx: ApiContext, m: string[]) => unknown;

/**
 * The /v1 surface the app uses. Wire format as the SDK sends it (esm/RequestSender.js
 * `_makeHeaders`, `_request`; esm/StripeResource.js puts GET params in the query):
 * form-encoded bodies, `Authorization: Bearer <key>`, `Stripe-Version`, and an
 * `Idempotency-Key` on every POST.
 */
export class ApiRoutes {
  private readonly routes: [string, RegExp, Handler][];

  constructor(
    private readonly store: FakeStore,
    private readonly checkout: Checkout,
    private readonly apiVersion: string,
  ) {
    this.routes = [
      ["POST", /^\/v1\/checkout\/sessions$/, (c) => this.createSession(c)],
      ["GET", /^\/v1\/checkout\/sessions\/([^/]+)$/, (c, [id]) => this.sessionOut(this.checkout.get(id ?? ""), c)],
      ["POST", /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/, (c, [id]) => this.sessionOut(this.checkout.expire(id ?? "", c.request), c)],
      ["GET", /^\/v1\/checkout\/sessions\/([^/]+)\/line_items$/, (_c, [id]) => lineItemsList(this.checkout.get(id ?? ""))],
      ["GET", /^\/v1\/payment_intents\/([^/]+)$/, (_c, [id]) => this.paymentIntent(id ?? "")],
      ["GET", /^\/v1\/events\/([^/]+)$/, (_c, [id]) => this.event(id ?? "")],
      ["GET", /^\/v1\/events$/, () => this.eventList()],
    ];
  }

  async handle(req: IncomingMessage, res: ServerResponse, url: URL): Promise<void> {
    const requestId = randomId("req_test_", 14);
    const method = req.method ?? "GET";
    const idemKey = method === "POST" ? headerValue(req, "idempotency-key") : undefined;
    const headers: Record<string, string> = {
      "Request-Id": requestId,
      "Stripe-Version": headerValue(req, "stripe-version") ?? this.apiVersion,
      ...(idemKey ? { "Idempotency-Key": idemKey } : {}),
    };
    try {
      const apiKey = authenticate(headerValue(req, "authorization"));
      const body = method === "POST" ? await readBody(req) : "";
      const type = headerValue(req, "content-type") ?? "";
      if (body && !type.startsWith("application/x-www-form-urlencoded")) {
        throw new ApiError(400, "invalid_request_error", "Request bodies must be application/x-www-form-urlencoded.");
      }
      let memo: { key: string; fingerprint: string } | undefined;
      if (idemKey) {
        const fingerprint = createHash("sha256").update(`${method} ${url.pathname} ${body}`).digest("hex");
        memo = { key: `${apiKey} ${idemKey}`, fingerprint };
        const seen = this.store.idempotency.get(memo.key);
        if (seen && seen.fingerprint !== fingerprint) {
          throw new ApiError(
            400,
            "idempotency_error",
            `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idemKey}' if you meant to execute a different request.`,
          );
        }
        if (seen) {
          sendRaw(res, seen.status, seen.body, { ...headers, "Content-Type": "application/json", "Idempotent-Replayed": "true" });
          return;
        }
      }
      const params = parseForm(method === "POST" ? body : url.search.slice(1));
      const ctx: ApiContext = { method, path: url.pathname, params, request: { id: requestId, idempotency_key: idemKey ?? null } };
      // Dispatch is synchronous, so no second request with the same key can slip in before the result is stored.
      const [status, out] = this.dispatch(ctx);
      // Like the real service, a request rejected by validation leaves no stored result.
      if (memo) this.store.idempotency.set(memo.key, { fingerprint: memo.fingerprint, status, body: JSON.stringify(out, null, 2) });
      this.store.save();
      sendJson(res, status, out, headers);
    } catch (err) {
      const apiError = toApiError(err);
      sendJson(res, apiError.status, apiError.toBody(), headers);
    }
  }

  private dispatch(ctx: ApiContext): [number, unknown] {
    for (const [method, pattern, handler] of this.routes) {
      const m = pattern.exec(ctx.path);
      if (m && method === ctx.method) {
        return [200, handler(ctx, m.slice(1).map(decodeURIComponent))];
      }
    }
    throw unrecognizedUrl(ctx.method, ctx.path);
  }

  private createSession(ctx: ApiContext): unknown {
    const params = parseCreateSession(ctx.params);
    return this.sessionOut(this.checkout.create(params), ctx);
  }

  private sessionOut(record: SessionRecord, ctx: ApiContext): unknown {
    const expand = parseExpand(ctx.params);
    const out: Record<string, unknown> = { ...structuredClone(record.session) };
    for (const field of expand) {
      if (field === "payment_intent") {
        const id = record.session.payment_intent;
        out.payment_intent = typeof id === "string" ? (this.store.paymentIntents.get(id) ?? id) : null;
      } else if (field === "line_items") {
        out.line_items = lineItemsList(record);
      } else {
        throw invalidParam("expand", `This property cannot be expanded (${field}). This local fake expands payment_intent and line_items.`);
      }
    }
    return out;
  }

  private paymentIntent(id: string): unknown {
    const intent = this.store.paymentIntents.get(id);
    if (!intent) throw noSuch("payment_intent", id, "intent");
    return intent;
  }

  private event(id: string): unknown {
    const record = this.store.findEvent(id);
    if (!record) throw noSuch("event", id, "id");
    return record.event;
  }

  private eventList(): unknown {
    const data = [...this.store.events].reverse().map((e) => e.event);
    return { object: "list", data, has_more: false, url: "/v1/events" };
  }
}

function authenticate(header: string | undefined): string {
  const key = /^Bearer\s+(\S+)$/i.exec(header ?? "")?.[1];
  if (!key) {
    throw new ApiError(
      401,
      "invalid_request_error",
      "You did not provide an API key. Send it in the Authorization header using Bearer auth (for this local fake any test-looking key works).",
    );
  }
  if (/^(sk|rk)_live_/.test(key)) {
    throw new ApiError(401, "invalid_request_error", "This local fake refuses live-mode keys. Use a test key.", "api_key_invalid");
  }
  return key;
}

function toApiError(err: unknown): ApiError {
  if (err instanceof ApiError) return err;
  if (err instanceof URIError) return new ApiError(400, "invalid_request_error", "Malformed percent-encoding in the URL.");
  if (err instanceof FormShapeError) {
    return new ApiError(400, "invalid_request_error", `Invalid parameter shape: ${err.param}`, "parameter_invalid", err.param);
  }
  const message = err instanceof Error ? err.message : String(err);
  return new ApiError(500, "api_error", `The local fake failed: ${message}`);
}
