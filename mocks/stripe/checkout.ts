import { invalidParam, noSuch } from "./errors";
import type { CreateSessionParams } from "./checkout-params";
import { buildEvent, buildSession, buildSucceededPaymentIntent, type EventRequest, type EventSubject } from "./objects";
import { nowSeconds, randomId, type FakeStore } from "./store";
import type { FakeEvent, FakeEventType, SessionRecord } from "./types";
import type { WebhookDispatcher } from "./webhooks";

export interface CheckoutConfig {
  pageBaseUrl: () => string;
  apiVersion: string;
  enabledEvents: FakeEventType[];
}

export type PayOutcome =
  | { kind: "paid"; record: SessionRecord; redirectTo: string }
  | { kind: "declined"; record: SessionRecord };

/** Session life cycle shared by the API, the hosted page and the control endpoints. */
export class Checkout {
  constructor(
    private readonly store: FakeStore,
    private readonly webhooks: WebhookDispatcher,
    private readonly config: CheckoutConfig,
  ) {}

  create(params: CreateSessionParams): SessionRecord {
    const id = randomId("cs_test_", 58);
    const session = buildSession(id, { ...params, url: `${this.config.pageBaseUrl()}/pay/${id}` });
    const record: SessionRecord = {
      session,
      lineItems: params.lineItems,
      paymentIntentData: params.paymentIntentData,
      declinedAttempts: 0,
    };
    this.store.sessions.set(id, record);
    this.store.save();
    return record;
  }

  /** Looks a session up, expiring it first if its time has passed. */
  find(id: string): SessionRecord | undefined {
    const record = this.store.sessions.get(id);
    if (record && record.session.status === "open" && record.session.expires_at <= nowSeconds()) {
      this.markExpired(record, undefined);
    }
    return record;
  }

  get(id: string): SessionRecord {
    const record = this.find(id);
    if (!record) throw noSuch("checkout.session", id, "session");
    return record;
  }

  expire(id: string, request?: EventRequest): SessionRecord {
    const record = this.get(id);
    if (record.session.status !== "open") {
      throw invalidParam(
        "session",
        `Only Checkout Sessions with a status in ["open"] can be expired. This session has status "${record.session.status}".`,
        "checkout_session_not_open",
      );
    }
    this.markExpired(record, request);
    return record;
  }

  sweepExpired(): void {
    for (const id of this.store.sessions.keys()) this.find(id);
  }

  /** A card submitted on the hosted page (or through /_fake). */
  pay(record: SessionRecord, outcome: "approve" | "decline"): PayOutcome {
    if (outcome === "decline") {
      // Checkout keeps the session open after a decline so the shopper can retry.
      record.declinedAttempts++;
      this.store.save();
      return { kind: "declined", record };
    }
    const intent = buildSucceededPaymentIntent(record);
    this.store.paymentIntents.set(intent.id, intent);
    const s = record.session;
    s.status = "complete";
    s.payment_status = "paid";
    s.payment_intent = intent.id;
    s.url = null;
    s.customer_details = {
      address: null,
      business_name: null,
      email: s.customer_email,
      individual_name: null,
      name: null,
      phone: null,
      tax_exempt: "none",
      tax_ids: [],
    };
    this.emit({ type: "payment_intent.succeeded", object: intent });
    this.emit({ type: "checkout.session.completed", object: s });
    const redirectTo = (s.success_url ?? "")
      .replaceAll("{CHECKOUT_SESSION_ID}", s.id)
      .replaceAll("%7BCHECKOUT_SESSION_ID%7D", s.id);
    return { kind: "paid", record, redirectTo };
  }

  private markExpired(record: SessionRecord, request: EventRequest | undefined): void {
    record.session.status = "expired";
    record.session.url = null;
    this.emit({ type: "checkout.session.expired", object: record.session }, request);
  }

  private emit(subject: EventSubject, request?: EventRequest): FakeEvent {
    const deliver = this.webhooks.enabled && this.config.enabledEvents.includes(subject.type);
    const event = buildEvent(subject, this.config.apiVersion, deliver ? 1 : 0, request);
    // Pretty-printed like the real payloads (from memory), so a handler that
    // re-serializes parsed JSON instead of verifying the raw body fails here too.
    const record = { event, payload: JSON.stringify(event, null, 2) };
    this.store.events.push(record);
    this.store.save();
    if (deliver) this.webhooks.enqueue(record);
    return event;
  }
}
