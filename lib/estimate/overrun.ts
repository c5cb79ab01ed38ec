import { formatCents, percentOfCents, type Cents } from "../money";
import type { AccountSettings, Refusal } from "./types";

/**
 * How far an approved line may grow before it needs approval again:
 * allowance = min(cap, max(floor, percent × approved amount)); cap null = no cap.
 */
export interface OverrunPolicy {
  percentMilli: number;
  capCents: Cents | null;
  floorCents: Cents;
}

/**
 * Default for a new account: the shape of Florida Statutes 559.909(1)(b), the greater of $10 or
 * 10 %, never more than $50 (so an $80 line may grow by $10, a $300 line by $30, a $1,000 line by $50).
 * db/schema.ts carries the same figures as the accounts table's column defaults.
 */
export const DEFAULT_OVERRUN_POLICY: Readonly<OverrunPolicy> = { percentMilli: 10_000, capCents: 5_000, floorCents: 1_000 };

export function overrunPolicyOf(
  account: Pick<AccountSettings, "overrunPercentMilli" | "overrunCapCents" | "overrunFloorCents">,
): OverrunPolicy {
  return {
    percentMilli: account.overrunPercentMilli,
    capCents: account.overrunCapCents,
    floorCents: account.overrunFloorCents,
  };
}

export function overrunAllowanceCents(approvedCents: Cents, policy: OverrunPolicy): Cents {
  const byPercent = percentOfCents(Math.max(0, approvedCents), policy.percentMilli);
  const floored = Math.max(policy.floorCents, byPercent);
  return Math.max(0, policy.capCents === null ? floored : Math.min(policy.capCents, floored));
}

export interface OverrunAmounts {
  approvedCents: Cents;
  revisedCents: Cents;
  allowanceCents: Cents;
  /** approved + allowance: the most the line may now cost without new consent. */
  ceilingCents: Cents;
  overCents: Cents;
}

export type OverrunVerdict = ({ ok: true } & OverrunAmounts) | Refusal<"overrun_exceeded", OverrunAmounts>;

/** A revision downward always holds; upward it holds up to approved + allowance, inclusive. */
export function checkOverrun(input: { approvedCents: Cents; revisedCents: Cents; policy: OverrunPolicy }): OverrunVerdict {
  const { approvedCents, revisedCents, policy } = input;
  const allowanceCents = overrunAllowanceCents(approvedCents, policy);
  const ceilingCents = approvedCents + allowanceCents;
  const amounts: OverrunAmounts = {
    approvedCents,
    revisedCents,
    allowanceCents,
    ceilingCents,
    overCents: Math.max(0, revisedCents - approvedCents),
  };
  if (revisedCents <= ceilingCents) return { ok: true, ...amounts };
  return {
    ok: false,
    code: "overrun_exceeded",
    detail:
      `the revised amount ${formatCents(revisedCents)} is ${formatCents(amounts.overCents)} over the approved ` +
      `${formatCents(approvedCents)}; the overrun allowance is ${formatCents(allowanceCents)}, so the line needs approval again`,
    amounts,
  };
}
