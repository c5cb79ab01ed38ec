/**
 * The product's enumerations, shared by the schema, the API and the UI.
 * Wire values are the API's (api-v1.md); labels are product.md's names.
 */

export const SHOP_ROLES = ["owner", "writer", "tech"] as const;
export const FLEET_ROLES = ["approver", "clerk", "viewer"] as const;
export const ROLES = [...SHOP_ROLES, ...FLEET_ROLES] as const;
export type ShopRole = (typeof SHOP_ROLES)[number];
export type FleetRole = (typeof FLEET_ROLES)[number];
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  writer: "Service writer",
  tech: "Technician",
  approver: "Approver",
  clerk: "Clerk",
  viewer: "Viewer",
};

export function isShopRole(role: string): role is ShopRole {
  return (SHOP_ROLES as readonly string[]).includes(role);
}

export const WORK_ORDER_STATUSES = [
  "checked_in",
  "diagnosing",
  "waiting_approval",
  "waiting_parts",
  "repairing",
  "final_check",
  "ready",
  "released",
] as const;
export type WorkOrderStatus = (typeof WORK_ORDER_STATUSES)[number];

export const STATUS_LABELS: Record<WorkOrderStatus, string> = {
  checked_in: "Checked in",
  diagnosing: "Diagnosing",
  waiting_approval: "Waiting on approval",
  waiting_parts: "Waiting on parts",
  repairing: "Repairing",
  final_check: "Final check",
  ready: "Ready for pickup",
  released: "Released",
};

export const OPEN_STATUSES = WORK_ORDER_STATUSES.filter((s) => s !== "released");

export const LINE_KINDS = ["labor", "part", "sublet", "fee"] as const;
export type LineKind = (typeof LINE_KINDS)[number];
export const LINE_KIND_LABELS: Record<LineKind, string> = {
  labor: "Labour",
  part: "Part",
  sublet: "Sublet",
  fee: "Fee",
};

export const LINE_STATES = ["draft", "proposed", "approved", "declined", "held", "in_progress", "done"] as const;
export type LineState = (typeof LINE_STATES)[number];
export const LINE_STATE_LABELS: Record<LineState, string> = {
  draft: "Draft",
  proposed: "Waiting on decision",
  approved: "Approved",
  declined: "Declined",
  held: "Held for later",
  in_progress: "In progress",
  done: "Done",
};

export const DECISIONS = ["approve", "decline", "hold"] as const;
export type Decision = (typeof DECISIONS)[number];
export const DECISION_LABELS: Record<Decision, string> = {
  approve: "Approve",
  decline: "Decline",
  hold: "Hold for later",
};

export const SEVERITIES = ["out_of_service", "fix_now", "plan", "note"] as const;
export type Severity = (typeof SEVERITIES)[number];
export const SEVERITY_LABELS: Record<Severity, string> = {
  out_of_service: "Out of service",
  fix_now: "Fix now",
  plan: "Plan for",
  note: "Note",
};

export const VERDICTS = ["within", "at_limit", "beyond"] as const;
export type Verdict = (typeof VERDICTS)[number];
export const VERDICT_LABELS: Record<Verdict, string> = {
  within: "Within limit",
  at_limit: "At limit",
  beyond: "Beyond limit",
};

export const METER_KINDS = ["odometer", "engine_hours"] as const;
export type MeterKind = (typeof METER_KINDS)[number];

export const INSPECTION_BASES = ["periodic", "state"] as const;
export type InspectionBasisValue = (typeof INSPECTION_BASES)[number];
export const INSPECTION_BASIS_LABELS: Record<InspectionBasisValue, string> = {
  periodic: "Periodic inspection, 12 months from the day (49 CFR 396.17(c))",
  state: "State inspection program, 12 months from the end of the month (49 CFR 396.17(f))",
};

/** A defect report's life: waiting for the shop, on a visit, fixed. */
export const SERVICE_REQUEST_STATUSES = ["open", "scheduled", "closed"] as const;
export type ServiceRequestStatus = (typeof SERVICE_REQUEST_STATUSES)[number];
export const SERVICE_REQUEST_STATUS_LABELS: Record<ServiceRequestStatus, string> = {
  open: "Reported, waiting for the shop",
  scheduled: "Checked in at the shop",
  closed: "Fixed",
};

export const INVOICE_STATUSES = ["open", "paid", "void"] as const;
export type InvoiceStatus = (typeof INVOICE_STATUSES)[number];

export const PAYMENT_METHODS = ["card", "cheque", "transfer", "cash"] as const;
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

/** Work-order numbers read like W-1042 on paper and in e-mail. */
export function workOrderLabel(number: number): string {
  return `W-${number}`;
}

export function invoiceLabel(number: number): string {
  return `INV-${number}`;
}

export function creditNoteLabel(number: number): string {
  return `CN-${number}`;
}
