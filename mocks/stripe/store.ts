import { randomInt } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { dirname } from "node:path";
import type { DeliveryRecord, EventRecord, IdempotencyRecord, PaymentIntent, SessionRecord } from "./types";

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

export function randomId(prefix: string, length = 24): string {
  let out = "";
  for (let i = 0; i < length; i++) out += ALPHABET[randomInt(ALPHABET.length)];
  return `${prefix}${out}`;
}

export const nowSeconds = (): number => Math.floor(Date.now() / 1000);

interface Snapshot {
  sessions: [string, SessionRecord][];
  paymentIntents: [string, PaymentIntent][];
  events: EventRecord[];
  deliveries: DeliveryRecord[];
  idempotency: [string, IdempotencyRecord][];
}

/** All state lives here, in memory; an optional JSON file survives restarts. */
export class FakeStore {
  sessions = new Map<string, SessionRecord>();
  paymentIntents = new Map<string, PaymentIntent>();
  events: EventRecord[] = [];
  deliveries: DeliveryRecord[] = [];
  idempotency = new Map<string, IdempotencyRecord>();

  constructor(private readonly file?: string) {
    if (file && existsSync(file)) this.load(file);
  }

  findEvent(id: string): EventRecord | undefined {
    return this.events.find((e) => e.event.id === id);
  }

  reset(): void {
    this.sessions.clear();
    this.paymentIntents.clear();
    this.events = [];
    this.deliveries = [];
    this.idempotency.clear();
    this.save();
  }

  save(): void {
    if (!this.file) return;
    const snapshot: Snapshot = {
      sessions: [...this.sessions],
      paymentIntents: [...this.paymentIntents],
      events: this.events,
      deliveries: this.deliveries,
      idempotency: [...this.idempotency],
    };
    mkdirSync(dirname(this.file), { recursive: true });
    const tmp = `${this.file}.tmp`;
    writeFileSync(tmp, JSON.stringify(snapshot));
    renameSync(tmp, this.file);
  }

  private load(file: string): void {
    // Trusted local file written by save(); a corrupt file should fail loudly.
    const snapshot = JSON.parse(readFileSync(file, "utf8")) as Snapshot;
    this.sessions = new Map(snapshot.sessions);
    this.paymentIntents = new Map(snapshot.paymentIntents);
    this.events = snapshot.events;
    this.deliveries = snapshot.deliveries;
    this.idempotency = new Map(snapshot.idempotency);
  }
}
