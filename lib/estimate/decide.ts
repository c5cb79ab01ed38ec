import type { Cents } from "../money";
import { runBatch, type BatchOk, type LineRefusal, type Outcome, type WithLine } from "./batch";
import { checkBudget, countedCents, checkSigningLimit, signingUsedCents } from "./limits";
import type {
  AccountSettings,
  Caller,
  Decision,
  EstimateLine,
  FiscalYear,
  LimitAmounts,
  Refusal,
  ShopSettings,
} from "./types";

export interface DecisionRequest {
  lineId: string;
  decision: Decision;
  expectedVersion: number;
  note?: string | null;
}

export interface DecideInput {
  /** As people read it ("W-1042"), for messages. */
  workOrderNumber: string;
  lines: readonly EstimateLine[];
  caller: Caller;
  shop: ShopSettings;
  account: AccountSettings;
  /** Approved amounts of the account in this fiscal year, all work orders, before this request. */
  budgetUsedCents: Cents;
  fiscalYear: FiscalYear;
  decisions: readonly DecisionRequest[];
}

export type LimitRefusal = WithLine<Refusal<"signing_limit_exceeded" | "budget_exceeded", LimitAmounts>>;
export type DecideRefusal = LineRefusal | LimitRefusal;
export type DecideResult = BatchOk | DecideRefusal;

/**
 * An approver's decisions on proposed lines, all or none. Approvals in the
 * batch count cumulatively against the caller's signing limit on this work
 * order and the account's repair budget; the first refusal is returned.
 */
export function decideLines(input: DecideInput): DecideResult {
  const { caller, workOrderNumber, account } = input;
  let signingUsed = signingUsedCents(input.lines, caller.id);
  let budgetUsed = input.budgetUsedCents;

  return runBatch<DecisionRequest, LimitRefusal>({
    workOrderNumber,
    lines: input.lines,
    shop: input.shop,
    account,
    steps: input.decisions,
    canDecide: (state) => state === "proposed",
    decide: (line, amountCents, step): Outcome | LimitRefusal => {
      const note = step.note ?? null;
      const record = { decision: step.decision, note, byUserId: caller.id, byStanding: false };
      if (step.decision !== "approve") {
        const state = step.decision === "decline" ? "declined" : "held";
        return { state, approvedByUserId: null, byStanding: false, approvedAmountCents: null, record };
      }
      const signing = checkSigningLimit({
        workOrderNumber,
        usedCents: signingUsed,
        newCents: amountCents,
        limitCents: caller.signingLimitCents,
      });
      if (!signing.ok) return { ...signing, lineId: line.id };
      const budget = checkBudget({
        usedCents: budgetUsed,
        newCents: amountCents,
        budgetCents: account.repairBudgetCents,
        fiscalYearLabel: input.fiscalYear.label,
      });
      if (!budget.ok) return { ...budget, lineId: line.id };
      signingUsed += countedCents(amountCents);
      budgetUsed += countedCents(amountCents);
      return { state: "approved", approvedByUserId: caller.id, byStanding: false, approvedAmountCents: amountCents, record };
    },
  });
}
