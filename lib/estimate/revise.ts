import type { Cents } from "../money";
import { approvedAmountOf } from "./limits";
import { checkOverrun, overrunPolicyOf, type OverrunAmounts } from "./overrun";
import { lineAmountOf } from "./pricing";
import { formatHours } from "./time-box";
import { isApprovedState, type AccountSettings, type EstimateLine, type Refusal } from "./types";

export interface ReviseInput {
  line: EstimateLine;
  quantityMilli: number;
  unitPriceCents: Cents;
  /** When given, a line changed since the editor loaded it is refused. */
  expectedVersion?: number;
  account: Pick<AccountSettings, "overrunPercentMilli" | "overrunCapCents" | "overrunFloorCents">;
}

/** Why an approved line went back to proposed. */
export type ReviseReason =
  | Omit<Refusal<"overrun_exceeded", OverrunAmounts>, "ok">
  | Omit<Refusal<"time_box_extension", { approvedMilli: number; revisedMilli: number }>, "ok">;

/**
 * unchanged: same quantity and price, nothing to write.
 * edited: the line was not approved (draft, proposed, declined, held); state kept.
 * approval_holds: approved line within its overrun allowance (or revised down).
 * back_to_proposed: approved line past its allowance; `reason` says why.
 */
export type ReviseOutcome = "unchanged" | "edited" | "approval_holds" | "back_to_proposed";

export type ReviseResult =
  | {
      ok: true;
      outcome: ReviseOutcome;
      line: EstimateLine;
      previousAmountCents: Cents;
      amountCents: Cents;
      /** The allowance check, for an approved line. */
      overrun: OverrunAmounts | null;
      reason: ReviseReason | null;
    }
  | Refusal<"stale_version", { expectedVersion: number; currentVersion: number }>;

/**
 * The shop changes a line's quantity or unit price. On an approved line the
 * overrun allowance is measured from the amount at approval, so several small
 * revisions cannot add up past it. A diagnosis line's hours are its time box,
 * which only the customer may extend: more hours always go back for approval.
 */
export function reviseLine(input: ReviseInput): ReviseResult {
  const { line, quantityMilli, unitPriceCents, expectedVersion } = input;
  if (expectedVersion !== undefined && expectedVersion !== line.version) {
    return {
      ok: false,
      code: "stale_version",
      detail: `this line changed since you loaded it (version ${expectedVersion}, now ${line.version}); reload and edit again`,
      amounts: { expectedVersion, currentVersion: line.version },
    };
  }
  const previousAmountCents = lineAmountOf(line);
  const revised: EstimateLine = { ...line, quantityMilli, unitPriceCents, version: line.version + 1 };
  const amountCents = lineAmountOf(revised);
  const base = { ok: true as const, previousAmountCents, amountCents };

  if (quantityMilli === line.quantityMilli && unitPriceCents === line.unitPriceCents) {
    return { ...base, outcome: "unchanged", line, overrun: null, reason: null };
  }
  if (!isApprovedState(line.state)) {
    return { ...base, outcome: "edited", line: revised, overrun: null, reason: null };
  }

  const verdict = checkOverrun({
    approvedCents: approvedAmountOf(line),
    revisedCents: amountCents,
    policy: overrunPolicyOf(input.account),
  });
  const overrun: OverrunAmounts = verdict.ok
    ? {
        approvedCents: verdict.approvedCents,
        revisedCents: verdict.revisedCents,
        allowanceCents: verdict.allowanceCents,
        ceilingCents: verdict.ceilingCents,
        overCents: verdict.overCents,
      }
    : verdict.amounts;
  let reason: ReviseReason | null = null;
  if (!verdict.ok) {
    reason = { code: verdict.code, detail: verdict.detail, amounts: verdict.amounts };
  } else if (line.isDiagnosis && quantityMilli > line.quantityMilli) {
    reason = {
      code: "time_box_extension",
      detail:
        `extending diagnosis from ${formatHours(line.quantityMilli)} to ${formatHours(quantityMilli)} ` +
        `needs the customer's approval`,
      amounts: { approvedMilli: line.quantityMilli, revisedMilli: quantityMilli },
    };
  }
  if (reason === null) return { ...base, outcome: "approval_holds", line: revised, overrun, reason };

  const backToProposed: EstimateLine = {
    ...revised,
    state: "proposed",
    approvedByUserId: null,
    byStanding: false,
    approvedAmountCents: null,
  };
  return { ...base, outcome: "back_to_proposed", line: backToProposed, overrun, reason };
}
