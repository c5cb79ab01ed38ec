import "server-only";
import Stripe from "stripe";
import { env } from "@/lib/env";

/**
 * Every call to the card-payment service lives here. Without STRIPE_SECRET_KEY
 * the same SDK talks to the local fake in mocks/stripe (same code path, other
 * address), so a machine with no account still takes payments end to end.
 */
export const LOCAL_FAKE_KEY = "sk_test_cotter_local_fake";

const holder = globalThis as unknown as { __cotterStripe?: { signature: string; client: Stripe } };

/** The configured key; an empty value counts as none. */
function realKey(): string | null {
  return env().STRIPE_SECRET_KEY || null;
}

export function stripeClient(): Stripe {
  const e = env();
  const real = realKey();
  const key = real ?? LOCAL_FAKE_KEY;
  const signature = `${key}|${real ? "" : e.FAKE_STRIPE_PORT}`;
  if (!holder.__cotterStripe || holder.__cotterStripe.signature !== signature) {
    const common = { maxNetworkRetries: 2, timeout: 15_000 };
    const client = real
      ? new Stripe(key, common)
      : new Stripe(key, { ...common, host: "127.0.0.1", port: e.FAKE_STRIPE_PORT, protocol: "http" });
    holder.__cotterStripe = { signature, client };
  }
  return holder.__cotterStripe.client;
}

export interface CheckoutRequest {
  invoiceId: string;
  accountId: string;
  /** "Invoice INV-5001" */
  title: string;
  description: string;
  amountCents: number;
  successUrl: string;
  cancelUrl: string;
  customerEmail: string | null;
}

export interface CheckoutSessionView {
  id: string;
  url: string | null;
  status: string | null;
  paymentStatus: string;
  amountTotal: number | null;
  expiresAt: number;
}

function view(s: Stripe.Checkout.Session): CheckoutSessionView {
  return { id: s.id, url: s.url, status: s.status, paymentStatus: s.payment_status, amountTotal: s.amount_total, expiresAt: s.expires_at };
}

/** The service did not answer, or answered that it is failing: worth trying again later, and nothing was done. */
export function isServiceUnavailable(error: unknown): boolean {
  return (
    error instanceof Stripe.errors.StripeConnectionError ||
    error instanceof Stripe.errors.StripeAPIError ||
    error instanceof Stripe.errors.StripeRateLimitError ||
    (error instanceof Stripe.errors.StripeError && (error.statusCode ?? 0) >= 500)
  );
}

/** A hosted Checkout page for one amount: the invoice's open balance. */
export async function createCheckoutSession(req: CheckoutRequest): Promise<CheckoutSessionView> {
  const metadata = { invoiceId: req.invoiceId, accountId: req.accountId, amountCents: String(req.amountCents) };
  const session = await stripeClient().checkout.sessions.create({
    mode: "payment",
    currency: "usd",
    line_items: [
      {
        quantity: 1,
        price_data: {
          currency: "usd",
          unit_amount: req.amountCents,
          product_data: { name: req.title, description: req.description },
        },
      },
    ],
    success_url: req.successUrl,
    cancel_url: req.cancelUrl,
    client_reference_id: req.invoiceId,
    ...(req.customerEmail ? { customer_email: req.customerEmail } : {}),
    metadata,
    payment_intent_data: { metadata, description: req.title },
  });
  return view(session);
}

export async function retrieveCheckoutSession(id: string): Promise<CheckoutSessionView> {
  return view(await stripeClient().checkout.sessions.retrieve(id));
}

/** Closes a payment page that must no longer take money (e.g. its invoice was voided). */
export async function expireCheckoutSession(id: string): Promise<void> {
  await stripeClient().checkout.sessions.expire(id);
}

/**
 * Verifies the signature over the exact bytes received and parses the event.
 * Throws on a missing, forged or stale signature.
 */
export function verifyWebhookEvent(rawBody: Buffer | string, signatureHeader: string | null): Stripe.Event {
  if (!signatureHeader) throw new Error("No Stripe-Signature header.");
  return stripeClient().webhooks.constructEvent(rawBody, signatureHeader, env().STRIPE_WEBHOOK_SECRET);
}

export type { Stripe };
