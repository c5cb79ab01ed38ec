/**
 * The local payment fake, driven by the real SDK (stripe-node 23.1.0). The outside
 * reference for every check is that SDK's own source: how it encodes requests
 * (esm/utils.js, esm/RequestSender.js), which error class a response becomes
 * (esm/Error.js `generateV1Error`) and how it verifies a webhook (esm/Webhooks.js).
 */
import { mkdtempSync, rmSync } from "node:fs";
import { createServer, type IncomingHttpHeaders } from "node:http";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DECLINED_MESSAGE, startFakeStripe, type FakeStripe } from "@/mocks/stripe/server";

const SECRET = "whsec_cotter_test_secret";

interface Received {
  headers: IncomingHttpHeaders;
  body: string;
}

/** A stand-in for the app's webhook route; answers with `statuses` in turn, then 200. */
async function startReceiver(statuses: number[] = []) {
  const received: Received[] = [];
  let notify = (): void => {};
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      received.push({ headers: req.headers, body: Buffer.concat(chunks).toString("utf8") });
      const status = statuses.shift() ?? 200;
      res.writeHead(status, { "Content-Type": "application/json" }).end(JSON.stringify({ received: status < 300 }));
      notify();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/api/webhooks/stripe`,
    received,
    /** Resolves when at least n requests have arrived (the test timeout catches "never"). */
    count: (n: number) =>
      new Promise<Received[]>((resolve) => {
        const check = (): void => void (received.length >= n && resolve(received.slice()));
        const previous = notify;
        notify = () => (previous(), check());
        check();
      }),
    close: () => new Promise<void>((resolve) => (server.close(() => resolve()), server.closeAllConnections())),
  };
}

function sdkFor(fake: FakeStripe, key = "sk_test_cotter_local"): Stripe {
  return new Stripe(key, { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0 });
}

const sessionParams = (overrides: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams => ({
  mode: "payment",
  line_items: [
    { quantity: 2, price_data: { currency: "usd", unit_amount: 12_345, product_data: { name: "Brake chamber, type 30/30" } } },
    { quantity: 1, price_data: { currency: "usd", unit_amount: 50, product_data: { name: "Shop supplies" } } },
  ],
  success_url: "http://localhost:3000/invoices/inv_42/paid?session={CHECKOUT_SESSION_ID}",
  cancel_url: "http://localhost:3000/invoices/inv_42",
  client_reference_id: "inv_42",
  customer_email: "fleet@example.com",
  metadata: { invoiceId: "inv_42", accountId: "acct_7" },
  payment_intent_data: { metadata: { invoiceId: "inv_42" } },
  ...overrides,
});

async function submitCard(fake: FakeStripe, sessionId: string, card: string) {
  const body = new URLSearchParams({ card_number: card, expiry: "12 / 40", cvc: "123" });
  return fetch(`${fake.url}/pay/${sessionId}`, { method: "POST", body, redirect: "manual" });
}

const eventsOf = (received: Received[], sessionId: string, type: string) =>
  received.map((r) => JSON.parse(r.body) as Stripe.Event).filter((e) => e.type === type && "id" in e.data.object && e.data.object.id === sessionId);

describe("fake payment service with the real SDK", () => {
  let fake: FakeStripe;
  let receiver: Awaited<ReturnType<typeof startReceiver>>;
  let stripe: Stripe;

  beforeAll(async () => {
    receiver = await startReceiver();
    fake = await startFakeStripe({ port: 0, webhookUrl: receiver.url, webhookSecret: SECRET, retryDelaysMs: [20, 40] });
    stripe = sdkFor(fake);
  });
  afterAll(async () => {
    await fake.close();
    await receiver.close();
  });

  it("creates and retrieves a Checkout Session with nested metadata (SDK form encoding, esm/utils.js)", async () => {
    const created = await stripe.checkout.sessions.create(sessionParams());
    expect(created.id).toMatch(/^cs_test_/);
    expect(created).toMatchObject({
      object: "checkout.session", mode: "payment", status: "open", payment_status: "unpaid", payment_intent: null,
      amount_total: 24_740, currency: "usd", client_reference_id: "inv_42", customer_email: "fleet@example.com",
      metadata: { invoiceId: "inv_42", accountId: "acct_7" }, livemode: false,
    });
    expect(created.url).toBe(`${fake.url}/pay/${created.id}`);
    expect(created.expires_at - created.created).toBe(24 * 60 * 60);
    // Response headers the SDK lifts onto lastResponse (esm/RequestSender.js `_addHeadersDirectlyToObject`).
    expect(created.lastResponse.requestId).toMatch(/^req_/);
    expect(created.lastResponse.apiVersion).toBe(Stripe.API_VERSION);
    const again = await stripe.checkout.sessions.retrieve(created.id);
    expect(again.metadata).toEqual({ invoiceId: "inv_42", accountId: "acct_7" });
    expect(again.success_url).toBe(created.success_url);
    const items = await stripe.checkout.sessions.listLineItems(created.id);
    expect(items.data.map((li) => [li.description, li.quantity, li.amount_total])).toEqual([
      ["Brake chamber, type 30/30", 2, 24_690],
      ["Shop supplies", 1, 50],
    ]);
  });

  it("pays with 4242 on the hosted page: 303 to success_url and a signed checkout.session.completed", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const page = await fetch(session.url ?? "");
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(html).toContain("Local test payment page");
    expect(html).toContain("$247.40");
    expect(html).toMatch(/<label for="card_number">/);

    const before = receiver.received.length;
    const res = await submitCard(fake, session.id, "4242 4242 4242 4242");
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(`http://localhost:3000/invoices/inv_42/paid?session=${session.id}`);

    const [delivery] = (await receiver.count(before + 1)).slice(before);
    const header = String(delivery?.headers["stripe-signature"]);
    expect(header).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    // Verified exactly as the app will: raw body + header + secret (esm/Webhooks.js constructEvent).
    const event = stripe.webhooks.constructEvent(delivery?.body ?? "", header, SECRET);
    expect(event).toMatchObject({ object: "event", type: "checkout.session.completed", livemode: false, api_version: Stripe.API_VERSION });
    expect(event.id).toMatch(/^evt_/);
    if (event.type !== "checkout.session.completed") throw new Error("wrong event type");
    expect(event.data.object).toMatchObject({ id: session.id, status: "complete", payment_status: "paid", metadata: { invoiceId: "inv_42" } });
    expect(() => stripe.webhooks.constructEvent(delivery?.body ?? "", header, "whsec_some_other_secret")).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );

    const paid = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent"] });
    expect(paid).toMatchObject({ status: "complete", payment_status: "paid", url: null });
    const intent = paid.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({ object: "payment_intent", status: "succeeded", amount: 24_740, metadata: { invoiceId: "inv_42" } });
    expect((await stripe.paymentIntents.retrieve(intent.id)).amount_received).toBe(24_740);
  });

  it("declines 4000…0002: message on the page, session stays open, no completed event; a retry with 4242 pays", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const res = await submitCard(fake, session.id, "4000 0000 0000 0002");
    const html = await res.text();
    expect(res.status).toBe(402);
    expect(html).toContain(DECLINED_MESSAGE);
    expect(html).toContain('href="http://localhost:3000/invoices/inv_42"');
    await fake.whenDeliveriesSettled();
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
    expect(eventsOf(receiver.received, session.id, "checkout.session.completed")).toHaveLength(0);
    expect(fake.events().filter((e) => e.data.object.id === session.id)).toHaveLength(0);

    expect((await submitCard(fake, session.id, "4242424242424242")).status).toBe(303);
    await fake.whenDeliveriesSettled();
    expect(eventsOf(receiver.received, session.id, "checkout.session.completed")).toHaveLength(1);
  });

  it("asks for a test card when another number is entered (the page's own rule; no outside source)", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const res = await submitCard(fake, session.id, "5555 5555 5555 4444");
    expect(res.status).toBe(422);
    expect(await res.text()).toContain("Use a test card number");
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
  });

  it("redelivers the same event id, freshly signed, for idempotency tests", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    await fetch(`${fake.url}/_fake/checkout/sessions/${session.id}/complete`, { method: "POST" });
    await fake.whenDeliveriesSettled();
    const [first] = eventsOf(receiver.received, session.id, "checkout.session.completed");
    const res = await fetch(`${fake.url}/_fake/events/${first?.id}/redeliver`, { method: "POST" });
    expect(((await res.json()) as { delivery: { response_status: number } }).delivery.response_status).toBe(200);
    const copies = receiver.received.filter((r) => eventsOf([r], session.id, "checkout.session.completed").length === 1);
    expect(copies).toHaveLength(2);
    const ids = copies.map((c) => stripe.webhooks.constructEvent(c.body, String(c.headers["stripe-signature"]), SECRET).id);
    expect(ids).toEqual([first?.id, first?.id]);
  });

  it("expires a session through the API and sends checkout.session.expired", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: "expired", url: null });
    await fake.whenDeliveriesSettled();
    expect(eventsOf(receiver.received, session.id, "checkout.session.expired")).toHaveLength(1);
    await expect(stripe.checkout.sessions.expire(session.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((await fetch(`${fake.url}/pay/${session.id}`)).status).toBe(410);
  });

  it("answers bad params with the SDK's StripeInvalidRequestError (esm/Error.js generateV1Error)", async () => {
    const noMode = stripe.checkout.sessions.create(sessionParams({ mode: undefined }));
    await expect(noMode).rejects.toMatchObject({ type: "StripeInvalidRequestError", statusCode: 400, code: "parameter_missing", param: "mode" });
    const noItems = stripe.checkout.sessions.create(sessionParams({ line_items: undefined }));
    await expect(noItems).rejects.toMatchObject({ code: "parameter_missing", param: "line_items" });
    const badUrl = stripe.checkout.sessions.create(sessionParams({ success_url: "not a url" }));
    await expect(badUrl).rejects.toMatchObject({ code: "url_invalid", param: "success_url" });
    const zeroQty = stripe.checkout.sessions.create(sessionParams({ line_items: [{ quantity: 0, price_data: { currency: "usd", unit_amount: 100, product_data: { name: "x" } } }] }));
    await expect(zeroQty).rejects.toMatchObject({ param: "line_items[0][quantity]" });
    // expires_at range from the SDK's doc comment on SessionCreateParams.expires_at.
    const tooLate = stripe.checkout.sessions.create(sessionParams({ expires_at: Math.floor(Date.now() / 1000) + 25 * 3600 }));
    await expect(tooLate).rejects.toMatchObject({ param: "expires_at" });
    const missing = stripe.checkout.sessions.retrieve("cs_test_nope");
    await expect(missing).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(missing).rejects.toMatchObject({ statusCode: 404, code: "resource_missing" });
    await expect(sdkFor(fake, "sk_live_nope").checkout.sessions.retrieve("cs_test_x")).rejects.toBeInstanceOf(
      Stripe.errors.StripeAuthenticationError,
    );
  });

  it("replays a repeated Idempotency-Key and refuses one reused with other params", async () => {
    const key = `idem-${Date.now()}`;
    const a = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key });
    const b = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: key });
    expect(b.id).toBe(a.id);
    const other = stripe.checkout.sessions.create(sessionParams({ client_reference_id: "inv_43" }), { idempotencyKey: key });
    await expect(other).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });
});

describe("webhook retries", () => {
  it("retries after a 500 answer and logs both attempts", async () => {
    const receiver = await startReceiver([500]);
    const fake = await startFakeStripe({ port: 0, webhookUrl: receiver.url, webhookSecret: SECRET, retryDelaysMs: [10, 20] });
    try {
      const session = await sdkFor(fake).checkout.sessions.create(sessionParams());
      await fetch(`${fake.url}/_fake/checkout/sessions/${session.id}/complete`, { method: "POST" });
      await fake.whenDeliveriesSettled();
      const bodies = receiver.received.map((r) => verifiedEventId(r));
      expect(bodies).toHaveLength(2);
      expect(bodies[0]).toBe(bodies[1]);
      expect(fake.deliveries().map((d) => [d.attempt, d.response_status, d.outcome])).toEqual([
        [1, 500, "failed"],
        [2, 200, "succeeded"],
      ]);
    } finally {
      await fake.close();
      await receiver.close();
    }
  });

  it("retries after a network error, up to the configured number of retries", async () => {
    const receiver = await startReceiver();
    const deadUrl = receiver.url;
    await receiver.close(); // nothing listens on this port any more
    const fake = await startFakeStripe({ port: 0, webhookUrl: deadUrl, webhookSecret: SECRET, retryDelaysMs: [5, 5] });
    try {
      const session = await sdkFor(fake).checkout.sessions.create(sessionParams());
      await fetch(`${fake.url}/_fake/checkout/sessions/${session.id}/complete`, { method: "POST" });
      await fake.whenDeliveriesSettled();
      const log = fake.deliveries();
      expect(log.map((d) => [d.attempt, d.outcome, d.response_status])).toEqual([
        [1, "failed", null],
        [2, "failed", null],
        [3, "failed", null],
      ]);
      expect(log.every((d) => typeof d.error === "string" && d.error.length > 0)).toBe(true);
    } finally {
      await fake.close();
    }
  });
});

describe("state file", () => {
  it("keeps sessions across a restart when stateFile is set", async () => {
    const dir = mkdtempSync(join(tmpdir(), "fake-pay-"));
    const stateFile = join(dir, "state.json");
    const first = await startFakeStripe({ port: 0, webhookUrl: null, webhookSecret: SECRET, stateFile });
    const session = await sdkFor(first).checkout.sessions.create(sessionParams());
    await first.close();
    const second = await startFakeStripe({ port: 0, webhookUrl: null, webhookSecret: SECRET, stateFile });
    try {
      expect((await sdkFor(second).checkout.sessions.retrieve(session.id)).metadata).toEqual({ invoiceId: "inv_42", accountId: "acct_7" });
    } finally {
      await second.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

function verifiedEventId(r: Received): string {
  const sdk = new Stripe("sk_test_unused");
  return sdk.webhooks.constructEvent(r.body, String(r.headers["stripe-signature"]), SECRET).id;
}
