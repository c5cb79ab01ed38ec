/**
 * Card payments end to end against the local payment fake, driven by the real
 * SDK: checkout for the open balance, the signed webhook as the only thing that
 * records a payment, exactly-once effect, refusal of forged events. Signature
 * scheme: HMAC-SHA256 over "<t>.<raw body>" as the SDK verifies it (stripe-node
 * esm/Webhooks.js); "delivered at least once" per the service's public docs (from memory).
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as checkout } from "@/app/api/v1/invoices/[id]/checkout/route";
import { POST as webhook } from "@/app/api/webhooks/stripe/route";
import { getDb } from "@/db/client";
import { recordManualPayment, resolveFlaggedPayment } from "@/db/queries/payments";
import { accounts, auditLog, checkoutSessions, invoices, payments, webhookEvents, type Invoice } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { signatureHeader, startFakeStripe, type FakeStripe } from "@/mocks/stripe/server";
import { call } from "./helpers/app";
import { asUser } from "./helpers/billing";
import { serveFetchHandler } from "./helpers/serve-fetch-handler";
import { freePort } from "@/tests/support/ports";
import { fileMailbox } from "./helpers/mail";

const SECRET = "whsec_integration_test_secret";

let fake: FakeStripe;
let app: { url: string; close(): Promise<void> };
const smtp = fileMailbox();

beforeAll(async () => {
  app = await serveFetchHandler((request) => webhook(request));
  fake = await startFakeStripe({ port: 0, webhookUrl: `${app.url}/api/webhooks/stripe`, webhookSecret: SECRET, retryDelaysMs: [50, 100] });
  delete process.env.STRIPE_SECRET_KEY;
  process.env.FAKE_STRIPE_PORT = String(fake.port);
  process.env.STRIPE_WEBHOOK_SECRET = SECRET;
  resetEnvCache();
});
afterAll(async () => {
  await fake.close();
  await app.close();
});

async function unpaidInvoiceOf(accountName: string, skip: string[] = []): Promise<Invoice> {
  const rows = await getDb()
    .select({ invoice: invoices })
    .from(invoices)
    .innerJoin(accounts, eq(accounts.id, invoices.accountId))
    .where(and(eq(accounts.name, accountName), eq(invoices.status, "open"), eq(invoices.paidCents, 0)))
    .orderBy(invoices.number);
  const found = rows.map((r) => r.invoice).find((i) => !skip.includes(i.id));
  if (!found) throw new Error(`no unpaid invoice for ${accountName}`);
  return found;
}

async function paymentsOf(invoiceId: string) {
  return getDb().select().from(payments).where(eq(payments.invoiceId, invoiceId));
}

async function reload(invoiceId: string): Promise<Invoice> {
  const [inv] = await getDb().select().from(invoices).where(eq(invoices.id, invoiceId));
  if (!inv) throw new Error("gone");
  return inv;
}

function completedEventOf(sessionId: string) {
  const event = fake.events().find((e) => e.type === "checkout.session.completed" && e.data.object.id === sessionId);
  if (!event) throw new Error("no completed event");
  return event;
}

const used: string[] = [];

describe("paying by card through Checkout", () => {
  it("the same webhook event delivered five times records one payment", async () => {
    const inv = await unpaidInvoiceOf("Brennan Township Highway Department");
    used.push(inv.id);
    const started = await call<{ url: string }>(checkout, { path: `/api/v1/invoices/${inv.id}/checkout`, method: "POST", params: { id: inv.id }, as: "clerk@brennan-twp.example" });
    expect(started.status).toBe(200);
    expect(started.body.url.startsWith(`${fake.url}/pay/cs_test_`)).toBe(true);
    const sessionId = started.body.url.split("/pay/")[1] ?? "";
    expect(fake.session(sessionId)?.session.amount_total).toBe(inv.totalCents);

    // Nothing is recorded until the signed event arrives.
    expect(await paymentsOf(inv.id)).toHaveLength(0);
    const receipt = smtp.waitFor((m) => m.to.includes("clerk@brennan-twp.example") && m.subject.startsWith("Receipt:") && m.subject.includes(`INV-${inv.number}`));
    await fetch(`${fake.url}/_fake/checkout/sessions/${sessionId}/complete`, { method: "POST" });
    await fake.whenDeliveriesSettled();

    const event = completedEventOf(sessionId);
    const redeliveries = await Promise.all(
      [1, 2, 3, 4].map(() => fetch(`${fake.url}/_fake/events/${event.id}/redeliver`, { method: "POST" }).then((r) => r.json() as Promise<{ delivery: { response_status: number } }>)),
    );
    expect(redeliveries.map((r) => r.delivery.response_status)).toEqual([200, 200, 200, 200]);
    expect(fake.deliveries().filter((d) => d.event_id === event.id && d.outcome === "succeeded")).toHaveLength(5);

    const recorded = await paymentsOf(inv.id);
    expect(recorded).toHaveLength(1);
    expect(recorded[0]).toMatchObject({ method: "card", amountCents: inv.totalCents, applied: true, flagged: false, checkoutSessionId: sessionId });
    expect(await reload(inv.id)).toMatchObject({ status: "paid", paidCents: inv.totalCents });
    const [seen] = await getDb().select().from(webhookEvents).where(eq(webhookEvents.id, event.id));
    expect(seen?.result).toBe("payment_recorded");

    const mail = await receipt;
    expect(mail.text).toContain("The invoice is now paid in full.");
  });

  it("opening Pay twice for the same balance reuses the open payment page", async () => {
    const inv = await unpaidInvoiceOf("Brennan Township Highway Department", used);
    const a = await call<{ url: string }>(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "clerk@brennan-twp.example" });
    const b = await call<{ url: string }>(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "supervisor@brennan-twp.example" });
    expect(a.body.url).toBe(b.body.url);
  });
});

describe("a session pays once, and only a session the app opened pays at all", () => {
  async function signed(event: object) {
    const body = JSON.stringify(event);
    return call<{ outcome: string }>(webhook, { path: "/api/webhooks/stripe", method: "POST", body, headers: { "content-type": "application/json", "stripe-signature": signatureHeader(body, SECRET) } });
  }
  const completed = (id: string, sessionId: string, amount: number, extra: object = {}) => ({
    id,
    object: "event",
    type: "checkout.session.completed",
    created: Math.floor(Date.now() / 1000),
    data: { object: { id: sessionId, object: "checkout.session", payment_status: "paid", amount_total: amount, currency: "usd", payment_intent: null, ...extra } },
  });

  it("a signed event for a session the app never opened records nothing, whatever its metadata says", async () => {
    const inv = await unpaidInvoiceOf("Alder Falls School District Transportation");
    const res = await signed(completed("evt_metadata_only", "cs_test_not_ours", inv.totalCents, { metadata: { invoiceId: inv.id } }));
    expect([res.status, res.body.outcome]).toEqual([200, "unknown_session"]);
    expect(await paymentsOf(inv.id)).toHaveLength(0);
    expect(await reload(inv.id)).toMatchObject({ status: "open", paidCents: 0 });
  });

  it("a second completed event for a session already paid, without a payment intent, records no second payment", async () => {
    const inv = await unpaidInvoiceOf("Alder Falls School District Transportation");
    const started = await call<{ url: string }>(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "transport@alder-falls-schools.example" });
    const sessionId = started.body.url.split("/pay/")[1] ?? "";
    await fetch(`${fake.url}/_fake/checkout/sessions/${sessionId}/complete`, { method: "POST" });
    await fake.whenDeliveriesSettled();
    expect(await paymentsOf(inv.id)).toHaveLength(1);
    const again = await signed(completed("evt_second_completion", sessionId, inv.totalCents));
    expect([again.status, again.body.outcome]).toEqual([200, "already_recorded"]);
    expect(await paymentsOf(inv.id)).toHaveLength(1);
  });

  it("refuses an oversize event while it streams, without waiting for the rest", async () => {
    let sent = 0;
    // 600 KB, then the sender never finishes: only a reader that counts as it goes can answer.
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent < 600 * 1024) {
          controller.enqueue(new Uint8Array(64 * 1024).fill(0x20));
          sent += 64 * 1024;
        }
      },
    });
    const request = new Request("http://localhost:3000/api/webhooks/stripe", { method: "POST", body, headers: { "content-type": "application/json", "stripe-signature": "t=1,v1=x" }, duplex: "half" } as RequestInit);
    const res = await webhook(request);
    expect(res.status).toBe(413);
    expect(sent).toBeLessThan(600 * 1024 + 1);
  });
});

describe("the payment service not answering", () => {
  it("answers 503 payment_service_unavailable, in words, and changes nothing", async () => {
    const inv = await unpaidInvoiceOf("Kettle Ridge Stone Co.", used);
    const before = { sessions: await getDb().select().from(checkoutSessions), audit: await getDb().select().from(auditLog) };
    // A port where nothing listens: the SDK's connection is refused, as when the service is down.
    process.env.FAKE_STRIPE_PORT = String(await freePort());
    resetEnvCache();
    try {
      const res = await call(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "office@kettle-ridge.example" });
      expect([res.status, res.body.code]).toEqual([503, "payment_service_unavailable"]);
      expect(res.body.detail).toMatch(/not answering.*nothing was charged/);
    } finally {
      process.env.FAKE_STRIPE_PORT = String(fake.port);
      resetEnvCache();
    }
    expect(await getDb().select().from(checkoutSessions)).toHaveLength(before.sessions.length);
    expect(await getDb().select().from(auditLog)).toHaveLength(before.audit.length);
    expect(await reload(inv.id)).toMatchObject({ status: inv.status, paidCents: inv.paidCents });
  });
});

describe("forged, unsigned or altered events", () => {
  async function post(body: string, signature: string | null) {
    const headers: Record<string, string> = { "content-type": "application/json" };
    if (signature) headers["stripe-signature"] = signature;
    return call(webhook, { path: "/api/webhooks/stripe", method: "POST", body, headers });
  }

  it("a bad signature is 400 and records nothing", async () => {
    const inv = await unpaidInvoiceOf("Kettle Ridge Stone Co.");
    const event = {
      id: "evt_forged_1",
      object: "event",
      type: "checkout.session.completed",
      created: Math.floor(Date.now() / 1000),
      data: {
        object: {
          id: "cs_test_forged",
          object: "checkout.session",
          payment_status: "paid",
          amount_total: inv.totalCents,
          currency: "usd",
          metadata: { invoiceId: inv.id },
          payment_intent: "pi_forged",
        },
      },
    };
    const body = JSON.stringify(event, null, 2);
    const forged = await post(body, signatureHeader(body, "whsec_not_the_secret"));
    expect([forged.status, forged.body.code]).toEqual([400, "invalid_signature"]);
    const unsigned = await post(body, null);
    expect(unsigned.status).toBe(400);
    // A real signature over other bytes: the amount was changed after signing.
    const altered = await post(body.replace(String(inv.totalCents), "50"), signatureHeader(body, SECRET));
    expect(altered.status).toBe(400);
    const stale = await post(body, signatureHeader(body, SECRET, Math.floor(Date.now() / 1000) - 3600));
    expect(stale.status).toBe(400);

    expect(await paymentsOf(inv.id)).toHaveLength(0);
    expect(await getDb().select().from(webhookEvents).where(eq(webhookEvents.id, "evt_forged_1"))).toHaveLength(0);
    expect(await reload(inv.id)).toMatchObject({ status: "open", paidCents: 0 });
  });

  it("a correctly signed event of a type we do not act on is acknowledged and ignored", async () => {
    const body = JSON.stringify({ id: "evt_other_1", object: "event", type: "customer.created", created: 1, data: { object: { id: "cus_1", object: "customer" } } });
    const res = await post(body, signatureHeader(body, SECRET));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ received: true, outcome: "ignored" });
  });
});

describe("an amount that does not match the open balance", () => {
  it("is recorded and flagged for the shop, not applied; the shop hears of it and decides", async () => {
    const inv = await unpaidInvoiceOf("Kettle Ridge Stone Co.");
    const started = await call<{ url: string }>(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "office@kettle-ridge.example" });
    const sessionId = started.body.url.split("/pay/")[1] ?? "";
    // Meanwhile a cheque for $100.00 arrives and the shop records it.
    await recordManualPayment(await asUser("writer@quarry-road.example"), inv.id, {
      method: "cheque",
      amountCents: 10_000,
      reference: "Cheque 9001",
      receivedAt: new Date().toISOString(),
    });
    const flaggedMail = smtp.waitFor((m) => m.to.includes("owner@quarry-road.example") && m.subject.includes(`INV-${inv.number}`) && m.subject.startsWith("Check a card payment"));
    const writerMail = smtp.waitFor((m) => m.to.includes("writer@quarry-road.example") && m.subject.includes(`INV-${inv.number}`) && m.subject.startsWith("Check a card payment"));
    const receipt = smtp.waitFor((m) => m.to.includes("office@kettle-ridge.example") && m.subject.startsWith("Receipt:") && m.text.includes("does not match"));
    await fetch(`${fake.url}/_fake/checkout/sessions/${sessionId}/complete`, { method: "POST" });
    await fake.whenDeliveriesSettled();

    const card = (await paymentsOf(inv.id)).find((p) => p.method === "card");
    const balance = inv.totalCents - 10_000;
    const dollars = (c: number) => `$${(c / 100).toLocaleString("en-US", { minimumFractionDigits: 2 })}`;
    expect(card).toMatchObject({
      amountCents: inv.totalCents,
      flagged: true,
      applied: false,
      flagReason: `Paid ${dollars(inv.totalCents)} but the open balance was ${dollars(balance)}.`,
    });
    expect(await reload(inv.id)).toMatchObject({ status: "open", paidCents: 10_000 });
    expect((await flaggedMail).to).toContain("owner@quarry-road.example");
    expect((await writerMail).text).toContain("recorded but not applied");
    expect((await receipt).subject).toContain(dollars(inv.totalCents));

    if (!card) throw new Error("no card payment");
    await resolveFlaggedPayment(await asUser("owner@quarry-road.example"), card.id, "returned");
    expect(await reload(inv.id)).toMatchObject({ status: "open", paidCents: 10_000 });
    expect((await paymentsOf(inv.id)).find((p) => p.id === card.id)).toMatchObject({ resolution: "returned", applied: false });
  });
});

describe("who may pay (api-v1.md)", () => {
  it("a viewer gets 403, another account's clerk 404, and a paid or void invoice cannot be paid", async () => {
    const inv = await unpaidInvoiceOf("Brennan Township Highway Department", used);
    const viewer = await call(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "foreman@brennan-twp.example" });
    expect([viewer.status, viewer.body.code]).toEqual([403, "forbidden"]);
    const other = await call(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "office@kettle-ridge.example" });
    expect([other.status, other.body.code]).toEqual([404, "not_found"]);
    const staff = await call(checkout, { path: "/x", method: "POST", params: { id: inv.id }, as: "writer@quarry-road.example" });
    expect(staff.status).toBe(403);
    const nobody = await call(checkout, { path: "/x", method: "POST", params: { id: inv.id } });
    expect(nobody.status).toBe(401);

    const [paid] = await getDb().select().from(invoices).where(eq(invoices.status, "paid")).limit(1);
    const [voided] = await getDb().select().from(invoices).where(and(eq(invoices.status, "void"), eq(invoices.accountId, inv.accountId))).limit(1);
    for (const closed of [paid, voided]) {
      if (!closed) throw new Error("fixture");
      const res = await call(checkout, { path: "/x", method: "POST", params: { id: closed.id }, as: "supervisor@brennan-twp.example" });
      expect(res.status).toBe(closed.accountId === inv.accountId ? 409 : 404);
    }
  });
});
