import type { Tx } from "@/db/client";

/** What every seed step gets: the database, a fixed "now", and the ids earlier steps made. */
export interface SeedContext {
  db: Tx;
  now: Date;
  ids: Map<string, string>;
}

export function id(ctx: SeedContext, key: string): string {
  const value = ctx.ids.get(key);
  if (!value) throw new Error(`seed: no id recorded for ${key}`);
  return value;
}

const DAY = 86_400_000;

/** An instant `days` before (negative: after) now, at a given hour UTC. */
export function daysAgo(ctx: SeedContext, days: number, hour = 15): string {
  const d = new Date(ctx.now.getTime() - days * DAY);
  d.setUTCHours(hour, (days * 37) % 60, 0, 0);
  return d.toISOString();
}

export function dateOnly(iso: string): string {
  return iso.slice(0, 10);
}
