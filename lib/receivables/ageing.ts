import { sumCents, type Cents } from "@/lib/money";
import { daysBetween } from "@/lib/dates";

/** Days past due, in the buckets a statement shows (api-v1.md names). */
export const AGEING_BUCKETS = ["current", "days1to30", "days31to60", "days61to90", "over90"] as const;
export type AgeingBucket = (typeof AGEING_BUCKETS)[number];

export const AGEING_LABELS: Record<AgeingBucket, string> = {
  current: "Current",
  days1to30: "1–30 days",
  days31to60: "31–60 days",
  days61to90: "61–90 days",
  over90: "Over 90 days",
};

export type Ageing = Record<AgeingBucket, Cents>;

/** Calendar days from the due date to asOf; 0 or less is not yet past due. */
export function daysPastDue(dueOn: string, asOf: string): number {
  return daysBetween(dueOn, asOf);
}

export function bucketOf(days: number): AgeingBucket {
  if (days <= 0) return "current";
  if (days <= 30) return "days1to30";
  if (days <= 60) return "days31to60";
  if (days <= 90) return "days61to90";
  return "over90";
}

export function emptyAgeing(): Ageing {
  return { current: 0, days1to30: 0, days31to60: 0, days61to90: 0, over90: 0 };
}

export interface Ageable {
  dueOn: string;
  balanceCents: Cents;
}

/**
 * Ages open balances on a calendar date (the shop's "today"). Invoices with
 * nothing left to pay are left out; oldest first.
 */
export function ageBalances<T extends Ageable>(items: readonly T[], asOf: string) {
  const ageing = emptyAgeing();
  const aged = items
    .filter((i) => i.balanceCents > 0)
    .map((i) => {
      const days = daysPastDue(i.dueOn, asOf);
      const bucket = bucketOf(days);
      ageing[bucket] += i.balanceCents;
      return { ...i, daysPastDue: days, bucket };
    })
    .sort((a, b) => b.daysPastDue - a.daysPastDue);
  const totalDueCents = sumCents(aged.map((i) => i.balanceCents));
  return { ageing, totalDueCents, items: aged };
}

export function addAgeing(a: Ageing, b: Ageing): Ageing {
  return {
    current: a.current + b.current,
    days1to30: a.days1to30 + b.days1to30,
    days31to60: a.days31to60 + b.days31to60,
    days61to90: a.days61to90 + b.days61to90,
    over90: a.over90 + b.over90,
  };
}
