import { formatCents, type Cents } from "../money";
import { checkBudget, checkSigningLimit, countedCents } from "./limits";

/*
 * "Approve all" offers what the approver can do: every waiting line that fits within their
 * signing limit and the repair budget, chosen in the order the lines are shown, the rest left
 * with the reason in words. The same checks as decideLines, in the same order, so the batch the
 * page sends is one the server accepts; the server still checks every limit on its own.
 */

export interface WaitingLine {
  id: string;
  description: string;
  amountCents: Cents;
}

export type LeftReason = "signing_limit" | "budget";

export interface FitPlan {
  fits: WaitingLine[];
  fitsCents: Cents;
  left: { line: WaitingLine; reason: LeftReason }[];
  /** What the signing limit has left after the lines that fit. */
  signingLeftCents: Cents;
  budgetLeftCents: Cents | null;
}

export function planApproveWhatFits(input: {
  /** In the order the approver sees them. */
  waiting: readonly WaitingLine[];
  signingLimitCents: Cents;
  signingUsedCents: Cents;
  budgetCents: Cents | null;
  budgetUsedCents: Cents;
}): FitPlan {
  let signingUsed = input.signingUsedCents;
  let budgetUsed = input.budgetUsedCents;
  const fits: WaitingLine[] = [];
  const left: FitPlan["left"] = [];
  for (const line of input.waiting) {
    const signing = checkSigningLimit({ workOrderNumber: "", usedCents: signingUsed, newCents: line.amountCents, limitCents: input.signingLimitCents });
    if (!signing.ok) {
      left.push({ line, reason: "signing_limit" });
      continue;
    }
    const budget = checkBudget({ usedCents: budgetUsed, newCents: line.amountCents, budgetCents: input.budgetCents, fiscalYearLabel: "" });
    if (!budget.ok) {
      left.push({ line, reason: "budget" });
      continue;
    }
    signingUsed += countedCents(line.amountCents);
    budgetUsed += countedCents(line.amountCents);
    fits.push(line);
  }
  return {
    fits,
    fitsCents: fits.reduce((s, l) => s + l.amountCents, 0),
    left,
    signingLeftCents: Math.max(0, input.signingLimitCents - signingUsed),
    budgetLeftCents: input.budgetCents === null ? null : Math.max(0, input.budgetCents - budgetUsed),
  };
}

/** Each line left, in words: what it costs and which limit it would pass, with what is left of it. */
export function describeLeftLines(plan: FitPlan, fiscalYearLabel: string): string[] {
  return plan.left.map(({ line, reason }) =>
    reason === "signing_limit"
      ? `“${line.description}” (${formatCents(line.amountCents)}) is more than the ${formatCents(plan.signingLeftCents)} your signing limit leaves on this work order${plan.fits.length ? " after the lines that fit" : ""}.`
      : `“${line.description}” (${formatCents(line.amountCents)}) would pass the repair budget: ${formatCents(plan.budgetLeftCents ?? 0)} is left in ${fiscalYearLabel}, so no approver can approve it until the budget allows.`,
  );
}
