import type { Cents } from "../money";

export const LINE_KINDS = ["labor", "part", "sublet", "fee"] as const;
export type LineKind = (typeof LINE_KINDS)[number];

export const LINE_STATES = ["draft", "proposed", "approved", "declined", "held", "in_progress", "done"] as const;
export type LineState = (typeof LINE_STATES)[number];

export type Decision = "approve" | "decline" | "hold";

/** One estimate line as stored (quantities in thousandths, money in cents). */
export interface EstimateLine {
  id: string;
  kind: LineKind;
  quantityMilli: number;
  unitPriceCents: Cents;
  taxable: boolean;
  /** Per unit of quantity. */
  coreChargeCents: Cents;
  state: LineState;
  version: number;
  /** null with byStanding true when the standing authorisation approved it. */
  approvedByUserId: string | null;
  byStanding: boolean;
  /** The line amount at approval; what signing limits and budgets count. */
  approvedAmountCents: Cents | null;
  isDiagnosis: boolean;
  /** A diagnosis extension line: the diagnosis line whose time box it extends. */
  extendsLineId?: string | null;
}

export interface ShopSettings {
  shopSuppliesRateMilliPct: number;
  shopSuppliesCapCents: Cents;
  shopSuppliesTaxable: boolean;
}

export interface AccountSettings {
  taxExempt: boolean;
  taxRateMilliPct: number;
  shopSuppliesExempt: boolean;
  standingAuthorisationCents: Cents;
  repairBudgetCents: Cents | null;
  /** 1 = January … 12 = December. */
  fiscalYearStartMonth: number;
  overrunPercentMilli: number;
  overrunCapCents: Cents | null;
  overrunFloorCents: Cents;
}

/** The approver making a decision: their user id and their own signing limit. */
export interface Caller {
  id: string;
  signingLimitCents: Cents;
}

/** One fiscal year, dates as ISO "YYYY-MM-DD", both ends inclusive. */
export interface FiscalYear {
  startDate: string;
  endDate: string;
  /** "FY 2026" when the year starts in January, else "FY 2026–27". */
  label: string;
  startYear: number;
}

/** What the server writes to the decision log, one per decided line. */
export interface DecisionRecord {
  lineId: string;
  decision: Decision;
  amountCents: Cents;
  /** The version the decision was made on (the one the approver saw). */
  lineVersion: number;
  note: string | null;
  byUserId: string | null;
  byStanding: boolean;
}

/** The new stored fields of a decided line plus its decision record. */
export interface LineChange {
  lineId: string;
  fromState: LineState;
  state: LineState;
  version: number;
  approvedByUserId: string | null;
  byStanding: boolean;
  approvedAmountCents: Cents | null;
  record: DecisionRecord;
}

export interface Refusal<C extends string, A> {
  ok: false;
  code: C;
  detail: string;
  amounts: A;
}

/** Amounts behind a limit verdict: the new amount, what was used, the total after, the limit. */
export interface LimitAmounts {
  newCents: Cents;
  usedCents: Cents;
  afterCents: Cents;
  limitCents: Cents;
}

export const APPROVED_STATES: readonly LineState[] = ["approved", "in_progress", "done"];

/** approved, in_progress and done all carry a standing approval. */
export function isApprovedState(state: LineState): boolean {
  return state === "approved" || state === "in_progress" || state === "done";
}
