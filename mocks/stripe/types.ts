import type Stripe from "stripe";

export type Session = Stripe.Checkout.Session;
export type PaymentIntent = Stripe.PaymentIntent;
export type FakeEvent =
  | Stripe.CheckoutSessionCompletedEvent
  | Stripe.CheckoutSessionExpiredEvent
  | Stripe.PaymentIntentSucceededEvent;
export type FakeEventType = FakeEvent["type"];

/** A line item as the fake stores it; money is integer cents. */
export interface StoredLineItem {
  id: string;
  name: string;
  description: string | null;
  unitAmount: number;
  quantity: number;
  currency: string;
  metadata: Record<string, string>;
}

/** What the fake keeps per Checkout Session beyond the public object. */
export interface SessionRecord {
  session: Session;
  lineItems: StoredLineItem[];
  paymentIntentData: { metadata: Record<string, string>; description: string | null };
  declinedAttempts: number;
}

export interface EventRecord {
  event: FakeEvent;
  /** The exact bytes every delivery of this event carries (signatures cover them). */
  payload: string;
}

export interface DeliveryRecord {
  id: string;
  event_id: string;
  event_type: string;
  url: string;
  trigger: "automatic" | "redeliver";
  attempt: number;
  started_at: number;
  finished_at: number | null;
  outcome: "in_flight" | "succeeded" | "failed";
  response_status: number | null;
  error: string | null;
  response_body: string | null;
  next_retry_at: number | null;
}

export interface IdempotencyRecord {
  fingerprint: string;
  status: number;
  body: string;
}

export interface FakeStripeOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  /** Where events are POSTed; null keeps events in the log only. */
  webhookUrl: string | null;
  webhookSecret: string;
  /** Base URL browsers use to reach the hosted page (defaults to the listening URL). */
  publicUrl?: string;
  /** Waits between automatic attempts; its length is the number of retries. */
  retryDelaysMs?: number[];
  deliveryTimeoutMs?: number;
  /** Event types sent to webhookUrl (all are still logged). */
  enabledEvents?: FakeEventType[];
  /** api_version stamped on events; defaults to the installed SDK's pinned version. */
  apiVersion?: string;
  /** If set, state is loaded from and saved to this JSON file. */
  stateFile?: string;
  /** How often open sessions past expires_at are expired. */
  expirySweepMs?: number;
  log?: (line: string) => void;
}
