import { formatCents } from "./money";

/** Turns an audited settings change into lines a person reads ("Standing authorisation: $155.00 → $200.00"). */
const LABELS: Record<string, string> = {
  standingAuthorisationCents: "Standing authorisation",
  repairBudgetCents: "Repair budget",
  fiscalYearStartMonth: "Fiscal year start month",
  overrunPercentMilli: "Overrun allowance percent",
  overrunCapCents: "Overrun cap",
  overrunFloorCents: "Overrun floor",
  taxExempt: "Tax exempt",
  taxExemptCertificate: "Exemption certificate",
  taxRateMilliPct: "Tax rate",
  poRequired: "PO required",
  paymentTermsDays: "Payment terms (days)",
  shopSuppliesExempt: "No shop supplies",
  signingLimitCents: "Signing limit",
};

function show(field: string, value: unknown): string {
  if (value === null || value === undefined || value === "") return "none";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number" && field.endsWith("Cents")) return formatCents(value);
  if (typeof value === "number" && (field.endsWith("MilliPct") || field.endsWith("PercentMilli"))) return `${value / 1000} %`;
  return String(value);
}

export function describeChange(detail: unknown): string[] {
  if (!detail || typeof detail !== "object") return [];
  const out: string[] = [];
  const prefix = "approver" in detail ? `${String((detail as { approver: unknown }).approver)}: ` : "";
  for (const [field, change] of Object.entries(detail)) {
    if (!change || typeof change !== "object" || !("from" in change)) continue;
    const { from, to } = change as { from: unknown; to: unknown };
    out.push(`${prefix}${LABELS[field] ?? field}: ${show(field, from)} → ${show(field, to)}`);
  }
  return out;
}
