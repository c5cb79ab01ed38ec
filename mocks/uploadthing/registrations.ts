import type { ServerResponse } from "node:http";

/** Body of POST /route-metadata, as the route handler sends it (handleUploadAction). */
export interface Registration {
  fileKeys: string[];
  metadata: unknown;
  isDev: boolean;
  callbackUrl: string;
  callbackSlug: string;
  awaitServerData: boolean;
  /** isDev only: the open JSON-lines response the route handler reads callbacks from. */
  stream: ServerResponse | null;
  /** Keys still waiting for their callback (or error) to be sent. */
  open: Set<string>;
}

/** What the app posted to /callback-result for one key. */
export type CallbackOutcome = { callbackData: unknown } | { error: string };

/** One-shot values by key that an async caller can wait for with a deadline. */
class Waiters<T> {
  private readonly waiting = new Map<string, Array<(v: T | undefined) => void>>();

  wait(key: string, timeoutMs: number): Promise<T | undefined> {
    return new Promise((resolve) => {
      const timer = setTimeout(() => this.drop(key, done), timeoutMs);
      const done = (v: T | undefined): void => {
        clearTimeout(timer);
        resolve(v);
      };
      this.waiting.set(key, [...(this.waiting.get(key) ?? []), done]);
    });
  }

  settle(key: string, value: T): boolean {
    const list = this.waiting.get(key);
    this.waiting.delete(key);
    for (const done of list ?? []) done(value);
    return (list?.length ?? 0) > 0;
  }

  private drop(key: string, done: (v: T | undefined) => void): void {
    const rest = (this.waiting.get(key) ?? []).filter((d) => d !== done);
    if (rest.length) this.waiting.set(key, rest);
    else this.waiting.delete(key);
    done(undefined);
  }

  cancelAll(): void {
    const all = [...this.waiting.values()].flat();
    this.waiting.clear();
    for (const done of all) done(undefined);
  }
}

export class Registrations {
  private readonly byKey = new Map<string, Registration>();
  private readonly registered = new Waiters<Registration>();
  private readonly results = new Waiters<CallbackOutcome>();

  add(reg: Registration): void {
    for (const key of reg.fileKeys) {
      this.byKey.set(key, reg);
      this.registered.settle(key, reg);
    }
  }

  /** In dev mode the route handler registers without waiting, so a PUT may arrive first. */
  async find(key: string, timeoutMs: number): Promise<Registration | undefined> {
    return this.byKey.get(key) ?? (await this.registered.wait(key, timeoutMs));
  }

  /** Call before sending the callback: the app may answer before the callback request returns. */
  expectResult(key: string, timeoutMs: number): Promise<CallbackOutcome | undefined> {
    return this.results.wait(key, timeoutMs);
  }

  deliverResult(key: string, outcome: CallbackOutcome): boolean {
    return this.results.settle(key, outcome);
  }

  /** Marks a key done; a dev stream ends once all its keys are done. */
  finish(key: string): void {
    const reg = this.byKey.get(key);
    this.byKey.delete(key);
    if (!reg) return;
    reg.open.delete(key);
    if (reg.open.size === 0 && reg.stream) {
      reg.stream.end();
      reg.stream = null;
    }
  }

  forget(reg: Registration): void {
    for (const key of reg.fileKeys) if (this.byKey.get(key) === reg) this.byKey.delete(key);
    reg.stream?.end();
    reg.stream = null;
  }

  closeAll(): void {
    for (const reg of new Set(this.byKey.values())) this.forget(reg);
    this.registered.cancelAll();
    this.results.cancelAll();
  }
}
