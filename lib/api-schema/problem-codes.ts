/**
 * Every `code` a problem document from the API (and a server action's refusal)
 * can carry. The contract (api-v1.md and README "Fleet API") promises these are
 * stable, so they are a closed list: a new refusal has to add its code here,
 * where the OpenAPI document's enum and the contract test see it.
 */
export const PROBLEM_CODES = [
  // Conventions of every route (api-v1.md "Conventions")
  "unauthenticated",
  "forbidden",
  "not_found",
  "invalid_input",
  "malformed_json",
  "malformed_url",
  "payload_too_large",
  "unsupported_media_type",
  "internal_error",
  "database_unreachable",
  "payment_service_unavailable",
  "upload_service_unavailable",
  "invalid_signature",
  // Decisions and the limits behind them
  "signing_limit_exceeded",
  "budget_exceeded",
  "standing_authorisation_exceeded",
  "overrun_exceeded",
  "stale_version",
  "not_pending",
  "not_higher_limit",
  "line_decided",
  "lines_pending",
  // Estimate, time clock and the diagnosis time box
  "nothing_to_send",
  "not_approved",
  "not_diagnosis",
  "not_labour",
  "not_clocked_in",
  "time_box_exceeded",
  "time_box_reached",
  "time_box_extension",
  "no_core_charge",
  // Visits, units and accounts
  "unit_in_shop",
  "unit_retired",
  "account_archived",
  "report_scheduled",
  "work_order_closed",
  "concern_closed",
  // Invoices and payments
  "already_invoiced",
  "nothing_to_invoice",
  "po_required",
  "not_payable",
  "payment_refused",
  "already_void",
  "has_payments",
  "has_credit_notes",
  "invoice_void",
  "not_flagged",
  "credit_refused",
  // People, invitations, password resets, first run
  "already_set_up",
  "already_invited",
  "cannot_deactivate_self",
  "invitation_not_found",
  "invitation_used",
  "invitation_withdrawn",
  "invitation_expired",
  "reset_not_found",
  "reset_used",
  "reset_expired",
  // The mail outbox
  "not_failed",
  "no_body",
] as const;

export type ProblemCode = (typeof PROBLEM_CODES)[number];

export function isProblemCode(value: string): value is ProblemCode {
  return (PROBLEM_CODES as readonly string[]).includes(value);
}
