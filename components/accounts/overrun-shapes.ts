import { FLORIDA_OVERRUN } from "@/lib/validation/account";

const dollars = (cents: number) => (cents / 100).toFixed(2);

// Overrun shapes from state consumer-repair laws (reference-values.md). They are
// starting points for a contract setting, not legal advice for fleets.
export const OVERRUN_SHAPES = [
  {
    label: "Florida 559.909(1)(b): $10 or 10 %, the greater, at most $50 (default)",
    percent: String(FLORIDA_OVERRUN.overrunPercentMilli / 1000),
    cap: dollars(FLORIDA_OVERRUN.overrunCapCents),
    floor: dollars(FLORIDA_OVERRUN.overrunFloorCents),
  },
  { label: "10 %, at most $50", percent: "10", cap: "50.00", floor: "0.00" },
  { label: "Michigan 1974 PA 300: $10 or 10 %, the lesser", percent: "10", cap: "10.00", floor: "0.00" },
  { label: "Maryland 14-1002(b) / Minnesota 325F.61(c): 10 %", percent: "10", cap: "", floor: "0.00" },
  { label: "California 9884.9(a): none — every increase needs consent", percent: "0", cap: "0.00", floor: "0.00" },
] as const;

/** The form's starting values for a new account. */
export const NEW_ACCOUNT_VALUES = {
  accountId: "",
  name: "",
  billingEmail: "",
  address: "",
  phone: "",
  standingAuthorisation: "0.00",
  repairBudget: "",
  fiscalYearStartMonth: 1,
  overrunPercent: OVERRUN_SHAPES[0].percent,
  overrunCap: OVERRUN_SHAPES[0].cap,
  overrunFloor: OVERRUN_SHAPES[0].floor,
  taxExempt: false,
  taxExemptCertificate: "",
  taxRate: "0",
  poRequired: false,
  paymentTermsDays: 30,
  shopSuppliesExempt: false,
};
