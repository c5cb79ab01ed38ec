import type { AccountSettings, EstimateLine, ShopSettings } from "@/lib/estimate";
import { lineAmountCents } from "@/lib/money";

let nextId = 1;

/** A proposed, untaxed line; override what a test cares about. */
export function line(overrides: Partial<EstimateLine> = {}): EstimateLine {
  return {
    id: `L-${nextId++}`,
    kind: "part",
    quantityMilli: 1000,
    unitPriceCents: 10_000,
    taxable: false,
    coreChargeCents: 0,
    state: "proposed",
    version: 1,
    approvedByUserId: null,
    byStanding: false,
    approvedAmountCents: null,
    isDiagnosis: false,
    ...overrides,
  };
}

/** An approved line, approved at its own amount unless told otherwise. */
export function approvedLine(by: string | null, overrides: Partial<EstimateLine> = {}): EstimateLine {
  const base = line({ state: "approved", approvedByUserId: by, byStanding: by === null, ...overrides });
  const amount = lineAmountCents(base.quantityMilli, base.unitPriceCents);
  return { ...base, approvedAmountCents: overrides.approvedAmountCents ?? amount };
}

export const shop: ShopSettings = {
  shopSuppliesRateMilliPct: 8_000,
  shopSuppliesCapCents: 5_000,
  shopSuppliesTaxable: false,
};

export const account: AccountSettings = {
  taxExempt: false,
  taxRateMilliPct: 6_250,
  shopSuppliesExempt: false,
  standingAuthorisationCents: 25_000,
  repairBudgetCents: 5_000_000,
  fiscalYearStartMonth: 7,
  overrunPercentMilli: 10_000,
  overrunCapCents: 5_000,
  overrunFloorCents: 0,
};
