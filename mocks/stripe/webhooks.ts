import { createHmac } from "node:crypto";
import { randomId } from "./store";
import type { FakeStore } from "./store";
import type { DeliveryRecord, EventRecord } from "./types";

/**
 * `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<raw body>">`,
 * keyed with the whole secret string (prefix included), which is what the SDK
 * checks in esm/Webhooks.js (`makeHMACContent`, `parseHeader`) using
 * esm/crypto/NodeCryptoProvider.js `computeHMACSignature`.
 */
export function signatureHeader(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac("sha256", secret).update(`${timestamp}.${payload}`, "utf8").digest("hex");
  return `t=${timestamp},v1=${v1}`;
}

export interface DispatcherOptions {
  url: string | null;
  secret: string;
  retryDelaysMs: number[];
  timeoutMs: number;
  log: (line: string) => void;
}

/**
 * Delivers events off the request path with retries after a non-2xx answer or a
 * network error; every attempt is re-signed with a fresh timestamp and logged.
 */
export class WebhookDispatcher {
  private timers = new Set<NodeJS.Timeout>();
  private aborts = new Set<AbortController>();
  private active = 0;
  private idleWaiters: (() => void)[] = [];
  private closed = false;
  /** Bumped by cancelAll so chains started before a reset stop retrying. */
  private generation = 0;

  constructor(private readonly store: FakeStore, private readonly opts: DispatcherOptions) {}

  get enabled(): boolean {
    return this.opts.url !== null;
  }

  /** Starts the automatic delivery chain; never awaited by the caller. */
  enqueue(record: EventRecord): void {
    if (!this.opts.url || this.closed) return;
    this.active++;
    void this.chain(record, 1, this.generation);
  }

  /** One manual attempt, awaited, no automatic retries (like a manual resend). */
  async redeliver(record: EventRecord): Promise<DeliveryRecord> {
    if (!this.opts.url) throw new Error("no webhookUrl configured");
    this.active++;
    try {
      return await this.attempt(record, 1, "redeliver", null);
    } finally {
      this.finishChain();
    }
  }

  /** Resolves once nothing is in flight and no retry is scheduled. */
  whenIdle(): Promise<void> {
    if (this.active === 0) return Promise.resolve();
    return new Promise((resolve) => this.idleWaiters.push(resolve));
  }

  close(): void {
    this.closed = true;
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
    for (const a of this.aborts) a.abort();
    this.active = 0;
    this.flushIdle();
  }

  cancelAll(): void {
    this.generation++;
    for (const t of this.timers) clearTimeout(t);
    this.active -= this.timers.size;
    this.timers.clear();
    this.flushIdle();
  }

  private async chain(record: EventRecord, attemptNo: number, generation: number): Promise<void> {
    const delay = this.opts.retryDelaysMs[attemptNo - 1];
    const nextAt = delay === undefined ? null : Date.now() + delay;
    const result = await this.attempt(record, attemptNo, "automatic", nextAt);
    if (this.closed) return;
    if (result.outcome === "succeeded" || delay === undefined || generation !== this.generation) {
      if (result.outcome === "failed") this.opts.log(`webhook ${record.event.id} gave up after ${attemptNo} attempts`);
      this.finishChain();
      return;
    }
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      void this.chain(record, attemptNo + 1, generation);
    }, delay);
    timer.unref();
    this.timers.add(timer);
  }

  private async attempt(
    record: EventRecord,
    attemptNo: number,
    trigger: DeliveryRecord["trigger"],
    nextRetryAt: number | null,
  ): Promise<DeliveryRecord> {
    const url = this.opts.url ?? "";
    const delivery: DeliveryRecord = {
      id: randomId("whdel_test_"),
      event_id: record.event.id,
      event_type: record.event.type,
      url,
      trigger,
      attempt: attemptNo,
      started_at: Date.now(),
      finished_at: null,
      outcome: "in_flight",
      response_status: null,
      error: null,
      response_body: null,
      next_retry_at: null,
    };
    this.store.deliveries.push(delivery);
    const abort = new AbortController();
    this.aborts.add(abort);
    const timeout = setTimeout(() => abort.abort(new Error(`timed out after ${this.opts.timeoutMs} ms`)), this.opts.timeoutMs);
    try {
      const res = await fetch(url, {
        method: "POST",
        redirect: "manual",
        signal: abort.signal,
        headers: {
          "Content-Type": "application/json; charset=utf-8",
          "User-Agent": "cotter-fake-payments/1 (local test double)",
          "Stripe-Signature": signatureHeader(record.payload, this.opts.secret),
        },
        body: record.payload,
      });
      delivery.response_status = res.status;
      delivery.response_body = (await res.text()).slice(0, 1000);
      delivery.outcome = res.status >= 200 && res.status < 300 ? "succeeded" : "failed";
    } catch (err) {
      delivery.outcome = "failed";
      delivery.error = abort.signal.aborted ? String(abort.signal.reason) : describe(err);
    } finally {
      clearTimeout(timeout);
      this.aborts.delete(abort);
    }
    delivery.finished_at = Date.now();
    if (delivery.outcome === "succeeded") record.event.pending_webhooks = 0;
    else delivery.next_retry_at = nextRetryAt;
    this.opts.log(
      `webhook ${record.event.type} ${record.event.id} attempt ${attemptNo} → ${delivery.response_status ?? delivery.error}`,
    );
    this.store.save();
    return delivery;
  }

  private finishChain(): void {
    this.active = Math.max(0, this.active - 1);
    this.flushIdle();
  }

  private flushIdle(): void {
    if (this.active !== 0) return;
    const waiters = this.idleWaiters;
    this.idleWaiters = [];
    for (const w of waiters) w();
  }
}

function describe(err: unknown): string {
  if (err instanceof Error) {
    const cause = err.cause instanceof Error ? `: ${err.cause.message}` : "";
    return `${err.message}${cause}`;
  }
  return String(err);
}
