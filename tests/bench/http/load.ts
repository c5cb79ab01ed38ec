import autocannon, { type Request } from "autocannon";

export interface LoadResult {
  /** 2xx responses per second over the round. */
  rps: number;
  p50: number;
  p99: number;
  ok: number;
  non2xx: number;
  errors: number;
  seconds: number;
  /** Mean response size in bytes. */
  bytes: number;
}

export interface LoadOptions {
  url: string;
  connections: number;
  /** Seconds; a round ends at this time or after `amount` requests, whichever comes first. */
  duration?: number;
  amount?: number;
  headers?: Record<string, string>;
  method?: "GET" | "POST";
  /** Builds each request (a different line per approval); returning null ends the round's supply. */
  setupRequest?: (request: Request) => Request | null;
}

/** One autocannon round. Latencies are autocannon's (ms); non-2xx responses are counted apart and never as throughput. */
export async function load(o: LoadOptions): Promise<LoadResult> {
  const result = await autocannon({
    url: o.url,
    connections: o.connections,
    pipelining: 1,
    // autocannon ends a round at its next sample tick, so its duration (the
    // divisor of every rate here) is a whole number of ticks: at its default
    // of one second, a round of a fixed number of approvals that took 4.1 s
    // counted as 5 s. A tenth of a second keeps that error small.
    sampleInt: 100,
    // A slow page is measured, not cut off.
    timeout: 120,
    ...(o.amount ? { amount: o.amount } : { duration: o.duration ?? 10 }),
    headers: o.headers,
    method: o.method ?? "GET",
    // autocannon takes a falsy request as "none left"; its types do not say so.
    requests: o.setupRequest ? [{ setupRequest: o.setupRequest as (r: Request) => Request }] : undefined,
  });
  const ok = result["2xx"];
  const seconds = result.duration;
  return {
    rps: ok / seconds,
    p50: result.latency.p50,
    p99: result.latency.p99,
    ok,
    non2xx: result.non2xx,
    errors: result.errors,
    seconds,
    bytes: result.requests.total > 0 ? result.throughput.total / result.requests.total : 0,
  };
}
