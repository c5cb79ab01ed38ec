import type { Cents } from "../money";
import { runBatch, type BatchOk, type BatchStep, type LineRefusal, type Outcome, type WithLine } from "./batch";
import { checkBudget, countedCents, checkStandingAuthorisation, standingUsedCents } from "./limits";
import type { AccountSettings, EstimateLine, FiscalYear, LimitAmounts, Refusal, ShopSettings } from "./types";

export interface StandingInput {
  workOrderNumber: string;
  lines: readonly EstimateLine[];
  shop: ShopSettings;
  account: AccountSettings;
  /** Approved amounts of the account in this fiscal year, all work orders, before this request. */
  budgetUsedCents: Cents;
  fiscalYear: FiscalYear;
  start: readonly BatchStep[];
  note?: string | null;
}

export type StandingLimitRefusal = WithLine<
  Refusal<"standing_authorisation_exceeded" | "budget_exceeded", LimitAmounts>
>;
export type StandingRefusal = LineRefusal | StandingLimitRefusal;
export type StandingResult = BatchOk | StandingRefusal;

/**
 * The shop approves draft or proposed lines by itself, all or none, within the
 * account's standing authorisation for this work order. Each is recorded as
 * approved by the standing authorisation (no user) and counts against the
 * repair budget like any approval.
 */
export function applyStandingAuthorisation(input: StandingInput): StandingResult {
  const { workOrderNumber, account } = input;
  let standingUsed = standingUsedCents(input.lines);
  let budgetUsed = input.budgetUsedCents;
  const note = input.note ?? null;

  return runBatch<BatchStep, StandingLimitRefusal>({
    workOrderNumber,
    lines: input.lines,
    shop: input.shop,
    account,
    steps: input.start,
    canDecide: (state) => state === "draft" || state === "proposed",
    decide: (line, amountCents): Outcome | StandingLimitRefusal => {
      const standing = checkStandingAuthorisation({
        workOrderNumber,
        usedCents: standingUsed,
        newCents: amountCents,
        limitCents: account.standingAuthorisationCents,
      });
      if (!standing.ok) return { ...standing, lineId: line.id };
      const budget = checkBudget({
        usedCents: budgetUsed,
        newCents: amountCents,
        budgetCents: account.repairBudgetCents,
        fiscalYearLabel: input.fiscalYear.label,
      });
      if (!budget.ok) return { ...budget, lineId: line.id };
      standingUsed += countedCents(amountCents);
      budgetUsed += countedCents(amountCents);
      return {
        state: "approved",
        approvedByUserId: null,
        byStanding: true,
        approvedAmountCents: amountCents,
        record: { decision: "approve", note, byUserId: null, byStanding: true },
      };
    },
  });
}
