import type { Tx } from "@/db/client";
import type { WorkOrderStatus } from "@/lib/domain";
import { env } from "@/lib/env";

/** What every seed step gets: the database, a fixed "now", and the ids earlier steps made. */
export interface SeedContext {
  db: Tx;
  now: Date;
  ids: Map<string, string>;
  /** When each work order first reached each status (ISO), so later steps happen in a sane order. */
  milestones: Map<string, Partial<Record<WorkOrderStatus, string>>>;
}

/** A work order's milestones, by its key ("W-1042"). */
export function milestones(ctx: SeedContext, woKey: string): Partial<Record<WorkOrderStatus, string>> {
  const m = ctx.milestones.get(woKey);
  if (!m) throw new Error(`seed: no timeline for ${woKey}`);
  return m;
}

/** The first milestone strictly after `iso` (the next status), or null when it is the last. */
export function nextMilestone(ctx: SeedContext, woKey: string, iso: string): string | null {
  const later = Object.values(milestones(ctx, woKey)).filter((t): t is string => !!t && t > iso).sort();
  return later[0] ?? null;
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

/**
 * The same instant moved into the shop's working day (7 a.m. to 5 p.m. in the shop's zone): a
 * finding or a status move at 3 a.m. reads wrong. Earlier than 7 a.m. moves to 7 a.m. plus the
 * minutes, later than 5 p.m. to 4 p.m. plus the minutes, the same day.
 */
export function inShopHours(ms: number, timeZone = env().APP_TIME_ZONE): number {
  const hour = Number(new Intl.DateTimeFormat("en-US", { hour: "numeric", hourCycle: "h23", timeZone }).format(new Date(ms)));
  if (hour < 7) return ms + (7 - hour) * 3_600_000;
  if (hour >= 17) return ms - (hour - 16) * 3_600_000;
  return ms;
}

/** The same instant, or the next morning's working hours when it falls outside them: moves only forward. */
export function laterInShopHours(ms: number, timeZone = env().APP_TIME_ZONE): number {
  const hour = Number(new Intl.DateTimeFormat("en-US", { hour: "numeric", hourCycle: "h23", timeZone }).format(new Date(ms)));
  if (hour < 7) return ms + (8 - hour) * 3_600_000;
  if (hour >= 17) return ms + (24 - hour + 8) * 3_600_000;
  return ms;
}
