import { ROLE_LABELS, type Role } from "./domain";
import { formatCents } from "./money";

/** Turns an audited change into lines a person reads ("Standing authorisation: $155.00 → $200.00"). */
const LABELS: Record<string, string> = {
  name: "Name",
  billingEmail: "Billing e-mail",
  address: "Billing address",
  phone: "Phone",
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
  archived: "Archived",
  contacts: "Contacts",
  role: "Role",
  active: "Signs in",
  unitsImported: "Units imported from a CSV file",
  unitNumber: "Unit number",
  vin: "VIN",
  serialOnly: "No VIN, serial only",
  serialNumber: "Serial number",
  year: "Year",
  description: "Description",
  plate: "Plate",
  lastInspectionOn: "Last annual inspection",
  inspectionBasis: "Inspection basis",
  keyOffDrainLimitMa: "Accepted key-off drain (mA)",
  retired: "Retired",
};

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

function show(field: string, value: unknown): string {
  if (value === null || value === undefined || value === "") return "none";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number" && field.endsWith("Cents")) return formatCents(value);
  if (typeof value === "number" && (field.endsWith("MilliPct") || field.endsWith("PercentMilli"))) return `${value / 1000} %`;
  if (typeof value === "number" && field === "fiscalYearStartMonth") return MONTHS[value - 1] ?? String(value);
  if (field === "role" && typeof value === "string" && value in ROLE_LABELS) return ROLE_LABELS[value as Role];
  return String(value);
}

export function describeChange(detail: unknown): string[] {
  if (!detail || typeof detail !== "object") return [];
  const out: string[] = [];
  const d = detail as Record<string, unknown>;
  const who = d.approver ?? d.person ?? (d.unit ? `Unit ${String(d.unit)}` : null);
  const prefix = who ? `${String(who)}: ` : "";
  for (const [field, change] of Object.entries(detail)) {
    if (!change || typeof change !== "object" || !("from" in change)) continue;
    const { from, to } = change as { from: unknown; to: unknown };
    // A new account lists what it was created with, not "none → …".
    out.push(from === null && "created" in detail ? `${prefix}${LABELS[field] ?? field}: ${show(field, to)}` : `${prefix}${LABELS[field] ?? field}: ${show(field, from)} → ${show(field, to)}`);
  }
  return out;
}
