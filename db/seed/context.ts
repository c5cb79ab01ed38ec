import type { Tx } from "@/db/client";
import type { WorkOrderStatus } from "@/lib/domain";

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
