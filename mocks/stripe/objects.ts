import { nowSeconds, randomId } from "./store";
import type { FakeEvent, PaymentIntent, Session, SessionRecord, StoredLineItem } from "./types";

/**
 * Builders for the API objects. They are typed with the SDK's own interfaces
 * (esm/resources/Checkout/Sessions.d.ts, PaymentIntents.d.ts, Events.d.ts), so a
 * field the real object always carries cannot be left out here.
 */

export interface NewSessionInput {
  url: string;
  lineItems: StoredLineItem[];
  currency: string;
  successUrl: string;
  cancelUrl: string | null;
  clientReferenceId: string | null;
  customerEmail: string | null;
  metadata: Record<string, string>;
  expiresAt: number;
}

export function buildSession(id: string, input: NewSessionInput): Session {
  const total = input.lineItems.reduce((sum, li) => sum + li.unitAmount * li.quantity, 0);
  return {
    id,
    object: "checkout.session",
    adaptive_pricing: null,
    after_expiration: null,
    allow_promotion_codes: null,
    allowed_payment_method_types: null,
    amount_subtotal: total,
    amount_total: total,
    automatic_tax: { enabled: false, liability: null, provider: null, status: null },
    billing_address_collection: null,
    cancel_url: input.cancelUrl,
    client_reference_id: input.clientReferenceId,
    client_secret: null,
    collected_information: null,
    consent: null,
    consent_collection: null,
    created: nowSeconds(),
    currency: input.currency,
    currency_conversion: null,
    custom_fields: [],
    custom_text: { after_submit: null, shipping_address: null, submit: null, terms_of_service_acceptance: null },
    customer: null,
    customer_account: null,
    customer_creation: "if_required",
    customer_details: null,
    customer_email: input.customerEmail,
    discounts: [],
    expires_at: input.expiresAt,
    integration_identifier: null,
    invoice: null,
    invoice_creation: null,
    livemode: false,
    locale: null,
    managed_payments: null,
    metadata: input.metadata,
    mode: "payment",
    origin_context: null,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: "if_required",
    payment_method_configuration_details: null,
    payment_method_options: { card: { request_three_d_secure: "automatic" } },
    payment_method_types: ["card"],
    payment_status: "unpaid",
    permissions: null,
    recovered_from: null,
    saved_payment_method_options: null,
    setup_intent: null,
    shipping_address_collection: null,
    shipping_cost: null,
    shipping_options: [],
    status: "open",
    submit_type: null,
    subscription: null,
    success_url: input.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: "hosted_page",
    url: input.url,
    wallet_options: null,
  };
}

export function buildSucceededPaymentIntent(record: SessionRecord): PaymentIntent {
  const s = record.session;
  const id = randomId("pi_test_");
  return {
    id,
    object: "payment_intent",
    allowed_payment_method_types: null,
    amount: s.amount_total ?? 0,
    amount_capturable: 0,
    amount_received: s.amount_total ?? 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: null,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: "automatic_async",
    client_secret: `${id}_secret_${randomId("", 25)}`,
    confirmation_method: "automatic",
    created: nowSeconds(),
    currency: s.currency ?? "usd",
    customer: null,
    customer_account: null,
    description: record.paymentIntentData.description,
    excluded_payment_method_types: null,
    last_payment_error: null,
    latest_charge: randomId("ch_test_"),
    livemode: false,
    managed_payments: null,
    metadata: { ...record.paymentIntentData.metadata },
    next_action: null,
    on_behalf_of: null,
    payment_method: randomId("pm_test_"),
    payment_method_configuration_details: null,
    payment_method_options: null,
    payment_method_types: ["card"],
    payment_record: null,
    processing: null,
    receipt_email: null,
    review: null,
    setup_future_usage: null,
    shipping: null,
    source: null,
    statement_descriptor: null,
    statement_descriptor_suffix: null,
    status: "succeeded",
    transfer_data: null,
    transfer_group: null,
  };
}

export interface EventRequest {
  id: string | null;
  idempotency_key: string | null;
}

const NO_REQUEST: EventRequest = { id: null, idempotency_key: null };

export type EventSubject =
  | { type: "checkout.session.completed" | "checkout.session.expired"; object: Session }
  | { type: "payment_intent.succeeded"; object: PaymentIntent };

/** Events caused by a shopper on the hosted page carry no API request (null ids). */
export function buildEvent(
  subject: EventSubject,
  apiVersion: string,
  pendingWebhooks: number,
  request: EventRequest = NO_REQUEST,
): FakeEvent {
  const base = {
    id: randomId("evt_test_"),
    object: "event" as const,
    api_version: apiVersion,
    created: nowSeconds(),
    livemode: false,
    pending_webhooks: pendingWebhooks,
    request,
  };
  // Deep copy: the event must keep the object as it was when the event happened.
  if (subject.type === "payment_intent.succeeded") {
    return { ...base, type: subject.type, data: { object: structuredClone(subject.object) } };
  }
  return { ...base, type: subject.type, data: { object: structuredClone(subject.object) } };
}

/** `GET /v1/checkout/sessions/:id/line_items` items, shaped like esm/resources/LineItems.d.ts. */
export function lineItemsList(record: SessionRecord) {
  const created = record.session.created;
  const data = record.lineItems.map((li) => ({
    id: li.id,
    object: "item" as const,
    adjustable_quantity: null,
    amount_discount: 0,
    amount_subtotal: li.unitAmount * li.quantity,
    amount_tax: 0,
    amount_total: li.unitAmount * li.quantity,
    currency: li.currency,
    description: li.name,
    metadata: li.metadata,
    price: {
      id: `price_test_${li.id.slice(3)}`,
      object: "price" as const,
      active: false,
      billing_scheme: "per_unit",
      created,
      currency: li.currency,
      custom_unit_amount: null,
      livemode: false,
      lookup_key: null,
      metadata: {},
      nickname: null,
      product: `prod_test_${li.id.slice(3)}`,
      recurring: null,
      tax_behavior: "unspecified",
      tiers_mode: null,
      transform_quantity: null,
      type: "one_time",
      unit_amount: li.unitAmount,
      unit_amount_decimal: String(li.unitAmount),
    },
    quantity: li.quantity,
  }));
  const url = `/v1/checkout/sessions/${record.session.id}/line_items`;
  return { object: "list" as const, data, has_more: false, url };
}
