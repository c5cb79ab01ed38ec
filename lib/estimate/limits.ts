import { formatCents, milliPctToPercent, type Cents } from "../money";
import { lineAmountOf } from "./pricing";
import {
  isApprovedState,
  type AccountSettings,
  type Caller,
  type EstimateLine,
  type LimitAmounts,
  type Refusal,
} from "./types";

export interface LimitOk {
  ok: true;
  newCents: Cents;
  usedCents: Cents;
  afterCents: Cents;
  /** null when there is no limit (an account without a repair budget). */
  limitCents: Cents | null;
  remainingCents: Cents | null;
}

export type StandingVerdict = LimitOk | Refusal<"standing_authorisation_exceeded", LimitAmounts>;
export type SigningVerdict = LimitOk | Refusal<"signing_limit_exceeded", LimitAmounts>;
export type BudgetVerdict = LimitOk | Refusal<"budget_exceeded", LimitAmounts>;

export interface LimitCheck {
  usedCents: Cents;
  newCents: Cents;
  limitCents: Cents;
}

/** The amount a line was approved at (its current amount if the row lacks one). */
export function approvedAmountOf(line: EstimateLine): Cents {
  return line.approvedAmountCents ?? lineAmountOf(line);
}

/**
 * What an approved amount counts against a limit. A credit (negative line) is
 * never refused, but it makes no room either: the shop may later revise or
 * withdraw it, and approvals made in its room would then stand past the limit.
 */
export function countedCents(amountCents: Cents): Cents {
  return Math.max(0, amountCents);
}

/** What the shop started by itself on this work order under the standing authorisation. */
export function standingUsedCents(lines: readonly EstimateLine[]): Cents {
  let used = 0;
  for (const line of lines) if (isApprovedState(line.state) && line.byStanding) used += countedCents(approvedAmountOf(line));
  return used;
}

/** The caller's own approvals on this work order, at the amounts they approved. */
export function signingUsedCents(lines: readonly EstimateLine[], userId: string): Cents {
  let used = 0;
  for (const line of lines) {
    if (isApprovedState(line.state) && !line.byStanding && line.approvedByUserId === userId) {
      used += countedCents(approvedAmountOf(line));
    }
  }
  return used;
}

// A credit (zero or negative amount) is never refused (see countedCents).
function exceeds(usedCents: Cents, newCents: Cents, limitCents: Cents): boolean {
  return newCents > 0 && usedCents + newCents > limitCents;
}

function within(usedCents: Cents, newCents: Cents, limitCents: Cents): LimitOk {
  const afterCents = usedCents + countedCents(newCents);
  return { ok: true, newCents, usedCents, afterCents, limitCents, remainingCents: limitCents - afterCents };
}

function amountsOf(usedCents: Cents, newCents: Cents, limitCents: Cents): LimitAmounts {
  return { newCents, usedCents, afterCents: usedCents + newCents, limitCents };
}

const $ = formatCents;

export function checkStandingAuthorisation(check: LimitCheck & { workOrderNumber: string }): StandingVerdict {
  const { workOrderNumber, usedCents, newCents, limitCents } = check;
  if (!exceeds(usedCents, newCents, limitCents)) return within(usedCents, newCents, limitCents);
  const a = amountsOf(usedCents, newCents, limitCents);
  return {
    ok: false,
    code: "standing_authorisation_exceeded",
    detail:
      `starting ${$(a.newCents)} without asking would bring the work started under the standing authorisation ` +
      `on ${workOrderNumber} to ${$(a.afterCents)}; the standing authorisation is ${$(a.limitCents)}`,
    amounts: a,
  };
}

export function checkSigningLimit(check: LimitCheck & { workOrderNumber: string }): SigningVerdict {
  const { workOrderNumber, usedCents, newCents, limitCents } = check;
  if (!exceeds(usedCents, newCents, limitCents)) return within(usedCents, newCents, limitCents);
  const a = amountsOf(usedCents, newCents, limitCents);
  return {
    ok: false,
    code: "signing_limit_exceeded",
    detail:
      `approving ${$(a.newCents)} would bring your approvals on ${workOrderNumber} to ${$(a.afterCents)}; ` +
      `your signing limit is ${$(a.limitCents)}`,
    amounts: a,
  };
}

/** `budgetCents` null means the account has no repair budget: never refused. */
export function checkBudget(check: {
  usedCents: Cents;
  newCents: Cents;
  budgetCents: Cents | null;
  fiscalYearLabel: string;
}): BudgetVerdict {
  const { usedCents, newCents, budgetCents, fiscalYearLabel } = check;
  if (budgetCents === null) {
    return { ok: true, usedCents, newCents, afterCents: usedCents + newCents, limitCents: null, remainingCents: null };
  }
  if (!exceeds(usedCents, newCents, budgetCents)) return within(usedCents, newCents, budgetCents);
  const a = amountsOf(usedCents, newCents, budgetCents);
  const left = Math.max(0, budgetCents - usedCents);
  return {
    ok: false,
    code: "budget_exceeded",
    detail:
      `approving ${$(a.newCents)} would bring this account's approvals in ${fiscalYearLabel} to ` +
      `${$(a.afterCents)}; the repair budget is ${$(a.limitCents)} (${$(left)} left)`,
    amounts: a,
  };
}

/** Exactly the API's `limits` object (api-v1.md, work order detail). */
export interface ApiLimits {
  standingAuthorisationCents: Cents;
  signingLimitCents: Cents | null;
  signingUsedCents: Cents | null;
  budgetCents: Cents | null;
  /** budget − used this fiscal year; negative when the budget was lowered below what is spent. */
  budgetRemainingCents: Cents | null;
  overrunPercent: number;
  overrunCapCents: Cents | null;
}

/** `caller` null for shop staff (no signing limit of their own). */
export function limitsView(input: {
  lines: readonly EstimateLine[];
  account: AccountSettings;
  caller: Caller | null;
  budgetUsedCents: Cents;
}): ApiLimits {
  const { lines, account, caller, budgetUsedCents } = input;
  const budget = account.repairBudgetCents;
  return {
    standingAuthorisationCents: account.standingAuthorisationCents,
    signingLimitCents: caller ? caller.signingLimitCents : null,
    signingUsedCents: caller ? signingUsedCents(lines, caller.id) : null,
    budgetCents: budget,
    budgetRemainingCents: budget === null ? null : budget - budgetUsedCents,
    overrunPercent: milliPctToPercent(account.overrunPercentMilli),
    overrunCapCents: account.overrunCapCents,
  };
}
