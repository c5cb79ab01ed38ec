/**
 * lib/server/payments/stripe.ts against msw handlers standing in for the service's
 * HTTP API. Request shape as the SDK sends it (stripe-node 23.1.0,
 * esm/utils.js: form-encoded, nested keys in brackets); signature as the SDK
 * verifies it (esm/Webhooks.js: HMAC-SHA256 of "<t>.<body>").
 */
import { createHmac } from "node:crypto";
import { http, HttpResponse } from "msw";
import { setupServer } from "msw/node";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { resetEnvCache } from "@/lib/env";
import { createCheckoutSession, verifyWebhookEvent } from "@/lib/server/payments/stripe";

const PORT = 12999;
const seen: { url: string; auth: string | null; form: URLSearchParams }[] = [];
const server = setupServer(
  http.post(`http://127.0.0.1:${PORT}/v1/checkout/sessions`, async ({ request }) => {
    seen.push({ url: request.url, auth: request.headers.get("authorization"), form: new URLSearchParams(await request.text()) });
    return HttpResponse.json({
      id: "cs_test_msw_1",
      object: "checkout.session",
      url: `http://127.0.0.1:${PORT}/pay/cs_test_msw_1`,
      status: "open",
      payment_status: "unpaid",
      amount_total: 89_193,
      expires_at: 2_000_000_000,
    });
  }),
);

beforeAll(() => {
  delete process.env.STRIPE_SECRET_KEY;
  process.env.FAKE_STRIPE_PORT = String(PORT);
  process.env.STRIPE_WEBHOOK_SECRET = "whsec_unit";
  resetEnvCache();
  server.listen({ onUnhandledRequest: "error" });
});
afterEach(() => server.resetHandlers());
afterAll(() => server.close());

describe("the payment module", () => {
  it("without a key, talks to the local fake's address with a test key and asks for one card payment of the balance", async () => {
    const session = await createCheckoutSession({
      invoiceId: "inv_1",
      accountId: "acc_1",
      title: "Invoice INV-5028",
      description: "W-1001, T-14: open balance",
      amountCents: 89_193,
      successUrl: "http://localhost:3000/fleet/invoices/inv_1?checkout=returned",
      cancelUrl: "http://localhost:3000/fleet/invoices/inv_1?checkout=cancelled",
      customerEmail: "clerk@brennan-twp.example",
    });
    expect(session).toMatchObject({ id: "cs_test_msw_1", status: "open", amountTotal: 89_193 });
    const [req] = seen;
    expect(req?.auth).toBe("Bearer sk_test_cotter_local_fake");
    const f = req?.form;
    expect(f?.get("mode")).toBe("payment");
    expect(f?.get("line_items[0][price_data][unit_amount]")).toBe("89193");
    expect(f?.get("line_items[0][price_data][currency]")).toBe("usd");
    expect(f?.get("line_items[0][quantity]")).toBe("1");
    expect(f?.get("metadata[invoiceId]")).toBe("inv_1");
    expect(f?.get("success_url")).toContain("checkout=returned");
    expect(f?.get("customer_email")).toBe("clerk@brennan-twp.example");
  });

  it("accepts an event signed with the webhook secret and refuses anything else", () => {
    const body = JSON.stringify({ id: "evt_1", object: "event", type: "checkout.session.completed", data: { object: {} } }, null, 2);
    const t = Math.floor(Date.now() / 1000);
    const sign = (secret: string, payload = body) => `t=${t},v1=${createHmac("sha256", secret).update(`${t}.${payload}`).digest("hex")}`;
    expect(verifyWebhookEvent(body, sign("whsec_unit")).id).toBe("evt_1");
    expect(() => verifyWebhookEvent(body, sign("whsec_other"))).toThrow();
    expect(() => verifyWebhookEvent(body, null)).toThrow();
    // Re-serialised JSON is not the bytes that were signed.
    expect(() => verifyWebhookEvent(JSON.stringify(JSON.parse(body)), sign("whsec_unit"))).toThrow();
  });
});
