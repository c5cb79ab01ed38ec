import { relations, sql } from "drizzle-orm";
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import {
  DECISIONS,
  INSPECTION_BASES,
  INVOICE_STATUSES,
  LINE_KINDS,
  LINE_STATES,
  METER_KINDS,
  PAYMENT_METHODS,
  ROLES,
  SERVICE_REQUEST_STATUSES,
  SEVERITIES,
  VERDICTS,
  WORK_ORDER_STATUSES,
} from "@/lib/domain";
import { newId } from "@/lib/ids";
import type { BillTo, ShopSnapshot, UnitSnapshot } from "@/lib/invoices/snapshot";

/*
 * Conventions: ids are random text; times are ISO 8601 UTC text; calendar
 * dates are YYYY-MM-DD text; money is integer cents (`…Cents`); quantities are
 * integer thousandths (`…Milli`); percentages are integer thousandths of a
 * percent (`…MilliPct`, 10 % = 10000).
 */

const id = () => text("id").primaryKey().$defaultFn(newId);
const createdAt = () => text("created_at").notNull().default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);
const updatedAt = () => text("updated_at").notNull().default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);
const bool = (name: string) => integer(name, { mode: "boolean" });

/** One row (id 1): the shop that runs this deployment. */
export const shopSettings = sqliteTable("shop_settings", {
  id: integer("id").primaryKey(),
  shopName: text("shop_name").notNull(),
  addressLine1: text("address_line1").notNull().default(""),
  addressLine2: text("address_line2").notNull().default(""),
  phone: text("phone").notNull().default(""),
  email: text("email").notNull().default(""),
  shopSuppliesRateMilliPct: integer("shop_supplies_rate_milli_pct").notNull().default(0),
  shopSuppliesCapCents: integer("shop_supplies_cap_cents").notNull().default(0),
  shopSuppliesTaxable: bool("shop_supplies_taxable").notNull().default(false),
  // Which line kinds are taxable is a shop setting; each line keeps its own flag.
  taxLabor: bool("tax_labor").notNull().default(false),
  taxParts: bool("tax_parts").notNull().default(true),
  taxSublet: bool("tax_sublet").notNull().default(false),
  taxFees: bool("tax_fees").notNull().default(false),
  invoiceFooter: text("invoice_footer").notNull().default(""),
  updatedAt: updatedAt(),
});

export const laborRates = sqliteTable("labor_rates", {
  id: id(),
  name: text("name").notNull(),
  rateCents: integer("rate_cents").notNull(),
  isDefault: bool("is_default").notNull().default(false),
  active: bool("active").notNull().default(true),
  position: integer("position").notNull().default(0),
  createdAt: createdAt(),
});

export const accounts = sqliteTable(
  "accounts",
  {
  id: id(),
  name: text("name").notNull(),
  billingEmail: text("billing_email").notNull().default(""),
  phone: text("phone").notNull().default(""),
  address: text("address").notNull().default(""),
  taxExempt: bool("tax_exempt").notNull().default(false),
  taxExemptCertificate: text("tax_exempt_certificate"),
  taxRateMilliPct: integer("tax_rate_milli_pct").notNull().default(0),
  poRequired: bool("po_required").notNull().default(false),
  paymentTermsDays: integer("payment_terms_days").notNull().default(30),
  standingAuthorisationCents: integer("standing_authorisation_cents").notNull().default(0),
  repairBudgetCents: integer("repair_budget_cents"),
  fiscalYearStartMonth: integer("fiscal_year_start_month").notNull().default(1),
  // Default allowance for a new account: the Florida shape, the greater of $10 or 10 %, never
  // more than $50 (reference-values.md; lib/estimate DEFAULT_OVERRUN_POLICY). Existing accounts
  // keep what they have: only the column default changed.
  overrunPercentMilli: integer("overrun_percent_milli").notNull().default(10_000),
  overrunCapCents: integer("overrun_cap_cents").default(5_000),
  overrunFloorCents: integer("overrun_floor_cents").notNull().default(1_000),
  shopSuppliesExempt: bool("shop_supplies_exempt").notNull().default(false),
  notes: text("notes").notNull().default(""),
  // Archived accounts keep their history but leave every list and cannot check units in.
  archivedAt: text("archived_at"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
  },
  // The account lists and pickers are by name.
  (t) => [index("accounts_name_idx").on(t.name)],
);

export const accountContacts = sqliteTable(
  "account_contacts",
  {
    id: id(),
    accountId: text("account_id").notNull().references(() => accounts.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    title: text("title").notNull().default(""),
    email: text("email").notNull().default(""),
    phone: text("phone").notNull().default(""),
    isBilling: bool("is_billing").notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index("account_contacts_account_idx").on(t.accountId)],
);

export const users = sqliteTable(
  "users",
  {
    id: id(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    accountId: text("account_id").references(() => accounts.id),
    signingLimitCents: integer("signing_limit_cents"),
    phone: text("phone").notNull().default(""),
    active: bool("active").notNull().default(true),
    // Sessions carry the version they were signed in under; raising it (a password
    // reset or change) ends every older session at its next request.
    sessionVersion: integer("session_version").notNull().default(0),
    lastSignInAt: text("last_sign_in_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("users_email_unique").on(t.email), index("users_account_idx").on(t.accountId)],
);

export const units = sqliteTable(
  "units",
  {
    id: id(),
    accountId: text("account_id").notNull().references(() => accounts.id),
    unitNumber: text("unit_number").notNull(),
    // Either a checked 17-character VIN, or serialOnly with the maker's serial:
    // never a silent pass (reference-values.md, VIN section).
    vin: text("vin"),
    serialOnly: bool("serial_only").notNull().default(false),
    serialNumber: text("serial_number"),
    year: integer("year"),
    description: text("description").notNull(),
    plate: text("plate").notNull().default(""),
    lastInspectionOn: text("last_inspection_on"),
    // 49 CFR 396.17: "periodic" counts 12 months from the day, "state" from the end of the month (396.17(f)).
    inspectionBasis: text("inspection_basis", { enum: INSPECTION_BASES }),
    inspectionDueOn: text("inspection_due_on"),
    // Key-off drain this unit's maker accepts, in mA; null means the default figure.
    keyOffDrainLimitMa: integer("key_off_drain_limit_ma"),
    notes: text("notes").notNull().default(""),
    // Retired units stay in history (visits, invoices) and leave every list.
    retiredAt: text("retired_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    // A fleet may give a retired unit's number to its replacement.
    uniqueIndex("units_account_number_unique").on(t.accountId, t.unitNumber).where(sql`retired_at is null`),
    index("units_vin_idx").on(t.vin),
    // The shop's unit list runs across accounts by number.
    index("units_number_idx").on(t.unitNumber, t.id),
  ],
);

export const meterReadings = sqliteTable(
  "meter_readings",
  {
    id: id(),
    unitId: text("unit_id").notNull().references(() => units.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: METER_KINDS }).notNull(),
    value: real("value").notNull(),
    // A lower reading is accepted only when the meter itself was replaced.
    meterReplaced: bool("meter_replaced").notNull().default(false),
    readAt: text("read_at").notNull(),
    workOrderId: text("work_order_id").references(() => workOrders.id),
    recordedBy: text("recorded_by").references(() => users.id),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("meter_readings_unit_kind_idx").on(t.unitId, t.kind, t.readAt), index("meter_readings_unit_at_idx").on(t.unitId, t.readAt)],
);

export const workOrders = sqliteTable(
  "work_orders",
  {
    id: id(),
    number: integer("number").notNull(),
    unitId: text("unit_id").notNull().references(() => units.id),
    // Copied from the unit so every fleet query scopes by account in its WHERE.
    accountId: text("account_id").notNull().references(() => accounts.id),
    status: text("status", { enum: WORK_ORDER_STATUSES }).notNull().default("checked_in"),
    title: text("title").notNull().default(""),
    assignedTechId: text("assigned_tech_id").references(() => users.id),
    promisedAt: text("promised_at"),
    poNumber: text("po_number"),
    openedAt: text("opened_at").notNull(),
    sentForApprovalAt: text("sent_for_approval_at"),
    releasedAt: text("released_at"),
    // True once nothing is left to invoice: a live invoice exists, or the visit was released with
    // no approved work. Kept by settleNothingToBill (db/queries/billing-state.ts) in the
    // transactions that change either, so the invoice queues read only the visits still open for billing.
    nothingToBill: bool("nothing_to_bill").notNull().default(false),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("work_orders_number_unique").on(t.number),
    // "Ready to invoice" and "waiting for a PO": visits still open for billing, newest first
    // (the queries spell the literal so the planner can use the partial index).
    index("work_orders_to_bill_number_idx").on(t.number).where(sql`nothing_to_bill = 0`),
    // A unit is in the shop on at most one open work order at a time.
    uniqueIndex("work_orders_one_open_per_unit").on(t.unitId).where(sql`status <> 'released'`),
    index("work_orders_account_status_idx").on(t.accountId, t.status),
    // Lists newest number first: open work only (the Floor, "in the shop"; the query spells the
    // condition as this literal so the planner can use the partial index), or every visit.
    index("work_orders_open_number_idx").on(t.number).where(sql`status <> 'released'`),
    index("work_orders_open_account_number_idx").on(t.accountId, t.number).where(sql`status <> 'released'`),
    index("work_orders_open_tech_number_idx").on(t.assignedTechId, t.number).where(sql`status <> 'released'`),
    index("work_orders_account_number_idx").on(t.accountId, t.number),
    index("work_orders_status_number_idx").on(t.status, t.number),
    // A unit's visits, newest first.
    index("work_orders_unit_idx").on(t.unitId, t.openedAt),
    index("work_orders_tech_idx").on(t.assignedTechId),
    index("work_orders_opened_idx").on(t.openedAt),
  ],
);

export const statusEvents = sqliteTable(
  "status_events",
  {
    id: id(),
    workOrderId: text("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    status: text("status", { enum: WORK_ORDER_STATUSES }).notNull(),
    note: text("note").notNull().default(""),
    byUserId: text("by_user_id").references(() => users.id),
    at: text("at").notNull(),
  },
  (t) => [index("status_events_wo_idx").on(t.workOrderId, t.at)],
);

export const concerns = sqliteTable(
  "concerns",
  {
    id: id(),
    unitId: text("unit_id").notNull().references(() => units.id),
    // The visit it was raised on; an intermittent concern stays open on the unit across visits.
    workOrderId: text("work_order_id").references(() => workOrders.id),
    position: integer("position").notNull().default(0),
    complaint: text("complaint").notNull(),
    cause: text("cause").notNull().default(""),
    correction: text("correction").notNull().default(""),
    intermittent: bool("intermittent").notNull().default(false),
    recordHint: text("record_hint").notNull().default(""),
    closedAt: text("closed_at"),
    conclusion: text("conclusion").notNull().default(""),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("concerns_wo_idx").on(t.workOrderId, t.position), index("concerns_unit_idx").on(t.unitId, t.createdAt)],
);

export const findings = sqliteTable(
  "findings",
  {
    id: id(),
    workOrderId: text("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    concernId: text("concern_id").references(() => concerns.id),
    title: text("title").notNull(),
    severity: text("severity", { enum: SEVERITIES }).notNull(),
    noteMarkdown: text("note_markdown").notNull().default(""),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("findings_wo_idx").on(t.workOrderId, t.createdAt)],
);

export const photos = sqliteTable(
  "photos",
  {
    id: id(),
    // Scope columns: a photo is served only to the shop and its unit's account.
    accountId: text("account_id").notNull().references(() => accounts.id),
    unitId: text("unit_id").notNull().references(() => units.id),
    workOrderId: text("work_order_id").references(() => workOrders.id),
    findingId: text("finding_id").references(() => findings.id, { onDelete: "set null" }),
    occurrenceId: text("occurrence_id").references(() => occurrences.id, { onDelete: "set null" }),
    serviceRequestId: text("service_request_id").references(() => serviceRequests.id, { onDelete: "set null" }),
    fileKey: text("file_key").notNull(),
    fileUrl: text("file_url").notNull(),
    thumbKey: text("thumb_key"),
    thumbUrl: text("thumb_url"),
    name: text("name").notNull().default(""),
    sizeBytes: integer("size_bytes").notNull().default(0),
    mime: text("mime").notNull(),
    width: integer("width"),
    height: integer("height"),
    uploadedBy: text("uploaded_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("photos_finding_idx").on(t.findingId), index("photos_wo_idx").on(t.workOrderId, t.createdAt)],
);

export const findingReadings = sqliteTable(
  "finding_readings",
  {
    id: id(),
    findingId: text("finding_id").notNull().references(() => findings.id, { onDelete: "cascade" }),
    position: integer("position").notNull().default(0),
    kind: text("kind").notNull(),
    // Where on the unit it was read ("axle 2 right", "front battery"): a stroke means little without it.
    location: text("location").notNull().default(""),
    // The typed input as entered (axle position, chamber type, temperature …), JSON.
    input: text("input", { mode: "json" }).notNull(),
    value: real("value").notNull(),
    unit: text("unit").notNull(),
    verdict: text("verdict", { enum: VERDICTS }).notNull(),
    limitText: text("limit_text").notNull(),
    limitValue: real("limit_value"),
    source: text("source").notNull(),
    sourceKind: text("source_kind").notNull(),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("finding_readings_finding_idx").on(t.findingId)],
);

export const estimateLines = sqliteTable(
  "estimate_lines",
  {
    id: id(),
    workOrderId: text("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    concernId: text("concern_id").references(() => concerns.id),
    findingId: text("finding_id").references(() => findings.id),
    position: integer("position").notNull().default(0),
    kind: text("kind", { enum: LINE_KINDS }).notNull(),
    description: text("description").notNull(),
    partNumber: text("part_number").notNull().default(""),
    quantityMilli: integer("quantity_milli").notNull(),
    unitPriceCents: integer("unit_price_cents").notNull(),
    taxable: bool("taxable").notNull().default(false),
    // Per unit of quantity; shown apart, never taxed, credited when the core comes back.
    coreChargeCents: integer("core_charge_cents").notNull().default(0),
    coreReturnedAt: text("core_returned_at"),
    laborRateId: text("labor_rate_id").references(() => laborRates.id),
    isDiagnosis: bool("is_diagnosis").notNull().default(false),
    state: text("state", { enum: LINE_STATES }).notNull().default("draft"),
    version: integer("version").notNull().default(1),
    approvedByUserId: text("approved_by_user_id").references(() => users.id),
    byStanding: bool("by_standing").notNull().default(false),
    approvedAmountCents: integer("approved_amount_cents"),
    approvedAt: text("approved_at"),
    // Why the line came back for a decision (e.g. revised past the overrun allowance).
    reopenReason: text("reopen_reason"),
    // Deferred work brought back on a later visit points at the line it came from.
    deferredFromLineId: text("deferred_from_line_id"),
    broughtBackAt: text("brought_back_at"),
    // A diagnosis extension (more hours asked of the customer) points at the line whose time box it widens.
    extendsLineId: text("extends_line_id"),
    // The approved hours the last 80 % warning and 100 % notice of this line's time box went out for,
    // so each goes once per box size (an extension starts again).
    boxWarnedMilli: integer("box_warned_milli"),
    boxReachedMilli: integer("box_reached_milli"),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("estimate_lines_wo_idx").on(t.workOrderId, t.position),
    // No index on state alone: ten states over every line ever written led the planner to walk
    // all held lines of the shop instead of the few of one visit.
    // Held and declined lines not yet brought back, per visit (a unit's deferred work); the queries
    // spell this condition as the same literal (isDeferredLine) so the planner can use the index.
    index("estimate_lines_deferred_idx").on(t.workOrderId, t.updatedAt).where(sql`state in ('held', 'declined') and brought_back_at is null`),
  ],
);

export const decisions = sqliteTable(
  "decisions",
  {
    id: id(),
    lineId: text("line_id").notNull().references(() => estimateLines.id, { onDelete: "cascade" }),
    workOrderId: text("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    accountId: text("account_id").notNull().references(() => accounts.id),
    decision: text("decision", { enum: DECISIONS }).notNull(),
    byUserId: text("by_user_id").references(() => users.id),
    byStanding: bool("by_standing").notNull().default(false),
    amountCents: integer("amount_cents").notNull(),
    lineVersion: integer("line_version").notNull(),
    note: text("note").notNull().default(""),
    at: text("at").notNull(),
  },
  (t) => [
    index("decisions_line_idx").on(t.lineId),
    index("decisions_account_at_idx").on(t.accountId, t.at),
    index("decisions_wo_idx").on(t.workOrderId, t.at),
  ],
);

/**
 * What an account has approved in one fiscal year, kept as a running total in the
 * transaction of every change that moves it (db/queries/budget-use.ts), so a decision
 * does not walk the account's whole history. A row is keyed by the fiscal year's exact
 * bounds (UTC instants, from the account's start month and the shop's time zone as they
 * were when the row was made) and starts from a full recount, so a changed start month or
 * zone makes new rows instead of reading wrong ones.
 */
export const accountBudgetUse = sqliteTable(
  "account_budget_use",
  {
    accountId: text("account_id").notNull().references(() => accounts.id, { onDelete: "cascade" }),
    fromAt: text("from_at").notNull(),
    toAt: text("to_at").notNull(),
    fiscalYear: text("fiscal_year").notNull(),
    usedCents: integer("used_cents").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.accountId, t.fromAt, t.toAt] })],
);

export const timeEntries = sqliteTable(
  "time_entries",
  {
    id: id(),
    lineId: text("line_id").notNull().references(() => estimateLines.id, { onDelete: "cascade" }),
    workOrderId: text("work_order_id").notNull().references(() => workOrders.id, { onDelete: "cascade" }),
    techId: text("tech_id").notNull().references(() => users.id),
    startedAt: text("started_at").notNull(),
    endedAt: text("ended_at"),
    // On a diagnosis line: the instant this running clock stops by itself, when the time box fills.
    // Every read counts a running entry up to it; the watcher and every clock write then close it.
    stopAt: text("stop_at"),
    stoppedBy: text("stopped_by", { enum: ["tech", "time_box"] }),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [
    index("time_entries_line_idx").on(t.lineId),
    index("time_entries_tech_idx").on(t.techId, t.endedAt),
    // The watcher looks for running clocks by when they stop.
    index("time_entries_running_stop_idx").on(t.endedAt, t.stopAt),
    // A work order's clocks, running ones first, then the latest: who is on the visit.
    index("time_entries_wo_idx").on(t.workOrderId, sql`(ended_at is null)`, t.startedAt),
  ],
);

export const invoices = sqliteTable(
  "invoices",
  {
    id: id(),
    number: integer("number").notNull(),
    workOrderId: text("work_order_id").notNull().references(() => workOrders.id),
    accountId: text("account_id").notNull().references(() => accounts.id),
    status: text("status", { enum: INVOICE_STATUSES }).notNull().default("open"),
    poNumber: text("po_number"),
    // Snapshot of who is billed, so an issued invoice never changes.
    billTo: text("bill_to", { mode: "json" }).$type<BillTo>().notNull(),
    // Snapshots of the issuing shop and of the unit and visit billed, for the same reason.
    shopSnapshot: text("shop_snapshot", { mode: "json" }).$type<ShopSnapshot>(),
    unitSnapshot: text("unit_snapshot", { mode: "json" }).$type<UnitSnapshot>(),
    taxExemptCertificate: text("tax_exempt_certificate"),
    taxRateMilliPct: integer("tax_rate_milli_pct").notNull().default(0),
    termsDays: integer("terms_days").notNull(),
    issuedAt: text("issued_at").notNull(),
    dueOn: text("due_on").notNull(),
    laborCents: integer("labor_cents").notNull().default(0),
    partsCents: integer("parts_cents").notNull().default(0),
    subletCents: integer("sublet_cents").notNull().default(0),
    feesCents: integer("fees_cents").notNull().default(0),
    shopSuppliesCents: integer("shop_supplies_cents").notNull().default(0),
    taxableCents: integer("taxable_cents").notNull().default(0),
    taxCents: integer("tax_cents").notNull().default(0),
    coreCents: integer("core_cents").notNull().default(0),
    totalCents: integer("total_cents").notNull(),
    paidCents: integer("paid_cents").notNull().default(0),
    // Credit notes against this invoice; the invoice itself never changes.
    creditedCents: integer("credited_cents").notNull().default(0),
    replacesInvoiceId: text("replaces_invoice_id"),
    voidedAt: text("voided_at"),
    voidedBy: text("voided_by").references(() => users.id),
    voidReason: text("void_reason"),
    issuedBy: text("issued_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("invoices_number_unique").on(t.number),
    // At most one live invoice per work order: a correction voids it first.
    uniqueIndex("invoices_one_live_per_wo").on(t.workOrderId).where(sql`status <> 'void'`),
    index("invoices_account_status_idx").on(t.accountId, t.status),
    // Lists newest number first, by account and state; open ones by due date (statements, receivables).
    index("invoices_account_number_idx").on(t.accountId, t.number),
    index("invoices_account_status_number_idx").on(t.accountId, t.status, t.number),
    index("invoices_status_number_idx").on(t.status, t.number),
    index("invoices_account_status_due_idx").on(t.accountId, t.status, t.dueOn),
    index("invoices_status_due_idx").on(t.status, t.dueOn),
    index("invoices_wo_idx").on(t.workOrderId, t.number),
    index("invoices_replaces_idx").on(t.replacesInvoiceId),
  ],
);

/**
 * A credit note: a numbered document that lowers what is owed on an issued
 * invoice (a core that came back, a price put right after money was paid).
 * Never more than the open balance, so nothing becomes a refund here.
 */
export const creditNotes = sqliteTable(
  "credit_notes",
  {
    id: id(),
    number: integer("number").notNull(),
    invoiceId: text("invoice_id").notNull().references(() => invoices.id),
    accountId: text("account_id").notNull().references(() => accounts.id),
    amountCents: integer("amount_cents").notNull(),
    reason: text("reason").notNull(),
    // The estimate line whose returned core this credits, when that is what it is for.
    coreLineId: text("core_line_id").references(() => estimateLines.id),
    issuedAt: text("issued_at").notNull(),
    issuedBy: text("issued_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("credit_notes_number_unique").on(t.number),
    index("credit_notes_invoice_idx").on(t.invoiceId, t.number),
    index("credit_notes_account_issued_idx").on(t.accountId, t.issuedAt),
  ],
);

export const invoiceLines = sqliteTable(
  "invoice_lines",
  {
    id: id(),
    invoiceId: text("invoice_id").notNull().references(() => invoices.id, { onDelete: "cascade" }),
    sourceLineId: text("source_line_id"),
    position: integer("position").notNull(),
    kind: text("kind", { enum: LINE_KINDS }).notNull(),
    description: text("description").notNull(),
    partNumber: text("part_number").notNull().default(""),
    quantityMilli: integer("quantity_milli").notNull(),
    unitPriceCents: integer("unit_price_cents").notNull(),
    amountCents: integer("amount_cents").notNull(),
    taxable: bool("taxable").notNull(),
    coreChargeCents: integer("core_charge_cents").notNull().default(0),
  },
  (t) => [index("invoice_lines_invoice_idx").on(t.invoiceId, t.position)],
);

export const payments = sqliteTable(
  "payments",
  {
    id: id(),
    invoiceId: text("invoice_id").notNull().references(() => invoices.id),
    accountId: text("account_id").notNull().references(() => accounts.id),
    method: text("method", { enum: PAYMENT_METHODS }).notNull(),
    amountCents: integer("amount_cents").notNull(),
    reference: text("reference").notNull().default(""),
    receivedAt: text("received_at").notNull(),
    recordedBy: text("recorded_by").references(() => users.id),
    checkoutSessionId: text("checkout_session_id"),
    paymentIntentId: text("payment_intent_id"),
    // An online amount that does not match the open balance is kept and flagged, never silently applied.
    flagged: bool("flagged").notNull().default(false),
    flagReason: text("flag_reason"),
    // Counted in the invoice's paid amount. A flagged payment waits for the shop:
    // applied to the invoice, or marked returned to the payer.
    applied: bool("applied").notNull().default(true),
    resolution: text("resolution", { enum: ["applied", "returned"] }),
    resolvedAt: text("resolved_at"),
    resolvedBy: text("resolved_by").references(() => users.id),
    note: text("note").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [
    index("payments_invoice_idx").on(t.invoiceId, t.receivedAt),
    index("payments_account_received_idx").on(t.accountId, t.receivedAt),
    uniqueIndex("payments_payment_intent_unique").on(t.paymentIntentId),
  ],
);

export const checkoutSessions = sqliteTable(
  "checkout_sessions",
  {
    id: text("id").primaryKey(),
    invoiceId: text("invoice_id").notNull().references(() => invoices.id),
    accountId: text("account_id").notNull().references(() => accounts.id),
    amountCents: integer("amount_cents").notNull(),
    status: text("status").notNull().default("open"),
    url: text("url").notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    completedAt: text("completed_at"),
  },
  (t) => [index("checkout_sessions_invoice_idx").on(t.invoiceId)],
);

/** Every payment-service event id we have acted on: delivery is at least once, effect exactly once. */
export const webhookEvents = sqliteTable("webhook_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  receivedAt: text("received_at").notNull(),
  result: text("result").notNull().default(""),
});

export const occurrences = sqliteTable(
  "occurrences",
  {
    id: id(),
    unitId: text("unit_id").notNull().references(() => units.id),
    accountId: text("account_id").notNull().references(() => accounts.id),
    concernId: text("concern_id").references(() => concerns.id),
    occurredAt: text("occurred_at").notNull(),
    hoursParked: real("hours_parked"),
    // Stored in °C whatever the person typed.
    ambientC: real("ambient_c"),
    symptom: text("symptom").notNull(),
    symptomText: text("symptom_text").notNull().default(""),
    batteryVolts: real("battery_volts"),
    recovered: bool("recovered"),
    note: text("note").notNull().default(""),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("occurrences_unit_idx").on(t.unitId, t.occurredAt), index("occurrences_concern_idx").on(t.concernId)],
);

export const auditLog = sqliteTable(
  "audit_log",
  {
    id: id(),
    at: text("at").notNull(),
    actorUserId: text("actor_user_id").references(() => users.id),
    actorLabel: text("actor_label").notNull(),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    accountId: text("account_id"),
    detail: text("detail", { mode: "json" }),
  },
  (t) => [index("audit_entity_idx").on(t.entityType, t.entityId, t.at), index("audit_account_idx").on(t.accountId, t.at)],
);

export const apiTokens = sqliteTable(
  "api_tokens",
  {
    id: id(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    // SHA-256 of the token; the token itself is shown once and never stored.
    tokenHash: text("token_hash").notNull(),
    prefix: text("prefix").notNull(),
    createdAt: createdAt(),
    lastUsedAt: text("last_used_at"),
    revokedAt: text("revoked_at"),
  },
  (t) => [uniqueIndex("api_tokens_hash_unique").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);

/** Gap-free sequences (work-order and invoice numbers), advanced inside the writing transaction. */
export const counters = sqliteTable("counters", {
  name: text("name").primaryKey(),
  value: integer("value").notNull(),
});

export const signInFailures = sqliteTable(
  "sign_in_failures",
  {
    id: id(),
    ip: text("ip").notNull(),
    email: text("email").notNull(),
    at: text("at").notNull(),
  },
  // Counted per client address and per account (the e-mail typed): one index each.
  (t) => [index("sign_in_failures_ip_at_idx").on(t.ip, t.at), index("sign_in_failures_email_at_idx").on(t.email, t.at)],
);

/** Where a queued e-mail's attachment comes from; built when the message is sent. */
export type MailAttachmentRef = { kind: "invoice_pdf"; invoiceId: string; filename: string };

export const MAIL_STATUSES = ["queued", "sending", "sent", "failed"] as const;

/**
 * Every e-mail the app sends, one row per recipient: written in the same
 * transaction as the change that causes it, then sent by the mail worker with
 * retries (lib/server/mail/worker.ts). A row with a group key collects several
 * events (decisions on one work order for one person) into one message until
 * its send-after time.
 */
export const mailOutbox = sqliteTable(
  "mail_outbox",
  {
    id: id(),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    template: text("template").notNull(),
    link: text("link").notNull().default(""),
    attachments: text("attachments", { mode: "json" }).$type<MailAttachmentRef[]>().notNull().default(sql`'[]'`),
    groupKey: text("group_key"),
    /** A grouped message's events so far, from which its text is rebuilt when another joins. */
    groupItems: text("group_items", { mode: "json" }).$type<unknown[]>(),
    status: text("status", { enum: MAIL_STATUSES }).notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    /** Not before this time: the end of a group's window, or the next retry. */
    sendAfter: text("send_after").notNull(),
    claimedAt: text("claimed_at"),
    lastError: text("last_error"),
    sentAt: text("sent_at"),
    // The message carries a single-use sign-in link: its link is kept without the token, and its body is dropped once sent.
    secret: bool("secret").notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [
    index("mail_outbox_due_idx").on(t.status, t.sendAfter),
    index("mail_outbox_group_idx").on(t.groupKey, t.status),
    index("mail_outbox_created_idx").on(t.createdAt, t.id),
    index("mail_outbox_status_created_idx").on(t.status, t.createdAt, t.id),
  ],
);

export type MailOutboxRow = typeof mailOutbox.$inferSelect;

/**
 * An invitation to sign in: the person sets their own password from an e-mailed
 * single-use link. Only the SHA-256 of the link's token is kept; re-sending
 * makes a new token (the old link stops working) and a new expiry.
 */
export const invitations = sqliteTable(
  "invitations",
  {
    id: id(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    accountId: text("account_id").references(() => accounts.id),
    signingLimitCents: integer("signing_limit_cents"),
    tokenHash: text("token_hash").notNull(),
    expiresAt: text("expires_at").notNull(),
    sentAt: text("sent_at").notNull(),
    invitedBy: text("invited_by").references(() => users.id),
    acceptedAt: text("accepted_at"),
    acceptedUserId: text("accepted_user_id").references(() => users.id),
    withdrawnAt: text("withdrawn_at"),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("invitations_token_unique").on(t.tokenHash),
    // One invitation waiting per address: invite again by re-sending it.
    uniqueIndex("invitations_one_live_per_email").on(t.email).where(sql`accepted_at is null and withdrawn_at is null`),
    index("invitations_account_idx").on(t.accountId),
  ],
);

/** A "forgot password" link: SHA-256 of the token only, one hour, used once. */
export const passwordResets = sqliteTable(
  "password_resets",
  {
    id: id(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    expiresAt: text("expires_at").notNull(),
    usedAt: text("used_at"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("password_resets_token_unique").on(t.tokenHash), index("password_resets_user_idx").on(t.userId, t.createdAt)],
);

/**
 * A defect report from the fleet, in the shape of a driver's vehicle
 * inspection report (49 CFR 396.11): which unit, what is wrong, who reported it.
 * Open until the shop checks the unit in (scheduled), closed once fixed.
 */
export const serviceRequests = sqliteTable(
  "service_requests",
  {
    id: id(),
    accountId: text("account_id").notNull().references(() => accounts.id),
    unitId: text("unit_id").notNull().references(() => units.id),
    reportedBy: text("reported_by").references(() => users.id),
    // The reporter's name as signed on the report (396.11(a)(3)); kept if the person leaves.
    reporterName: text("reporter_name").notNull(),
    status: text("status", { enum: SERVICE_REQUEST_STATUSES }).notNull().default("open"),
    odometer: real("odometer"),
    engineHours: real("engine_hours"),
    note: text("note").notNull().default(""),
    workOrderId: text("work_order_id").references(() => workOrders.id),
    scheduledAt: text("scheduled_at"),
    closedAt: text("closed_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("service_requests_account_status_idx").on(t.accountId, t.status, t.createdAt),
    index("service_requests_status_idx").on(t.status, t.createdAt),
    index("service_requests_account_created_idx").on(t.accountId, t.createdAt, t.id),
    index("service_requests_created_idx").on(t.createdAt, t.id),
    index("service_requests_unit_idx").on(t.unitId),
    index("service_requests_wo_idx").on(t.workOrderId),
  ],
);

export const serviceRequestDefects = sqliteTable(
  "service_request_defects",
  {
    id: id(),
    requestId: text("request_id").notNull().references(() => serviceRequests.id, { onDelete: "cascade" }),
    position: integer("position").notNull().default(0),
    // One of the parts 396.11(a)(2) names (brakes, steering, lights …), or empty.
    area: text("area").notNull().default(""),
    description: text("description").notNull(),
    outOfService: bool("out_of_service").notNull().default(false),
  },
  (t) => [index("service_request_defects_request_idx").on(t.requestId, t.position)],
);

export const accountsRelations = relations(accounts, ({ many }) => ({
  users: many(users),
  units: many(units),
  contacts: many(accountContacts),
  workOrders: many(workOrders),
}));

export const usersRelations = relations(users, ({ one }) => ({
  account: one(accounts, { fields: [users.accountId], references: [accounts.id] }),
}));

export const unitsRelations = relations(units, ({ one, many }) => ({
  account: one(accounts, { fields: [units.accountId], references: [accounts.id] }),
  meterReadings: many(meterReadings),
  workOrders: many(workOrders),
}));

export const workOrdersRelations = relations(workOrders, ({ one, many }) => ({
  unit: one(units, { fields: [workOrders.unitId], references: [units.id] }),
  account: one(accounts, { fields: [workOrders.accountId], references: [accounts.id] }),
  assignedTech: one(users, { fields: [workOrders.assignedTechId], references: [users.id] }),
  statusEvents: many(statusEvents),
  concerns: many(concerns),
  findings: many(findings),
  lines: many(estimateLines),
}));

export const findingsRelations = relations(findings, ({ one, many }) => ({
  workOrder: one(workOrders, { fields: [findings.workOrderId], references: [workOrders.id] }),
  photos: many(photos),
  readings: many(findingReadings),
}));

export const estimateLinesRelations = relations(estimateLines, ({ one, many }) => ({
  workOrder: one(workOrders, { fields: [estimateLines.workOrderId], references: [workOrders.id] }),
  decisions: many(decisions),
  timeEntries: many(timeEntries),
}));

export type ShopSettings = typeof shopSettings.$inferSelect;
export type LaborRate = typeof laborRates.$inferSelect;
export type Account = typeof accounts.$inferSelect;
export type User = typeof users.$inferSelect;
export type Unit = typeof units.$inferSelect;
export type MeterReading = typeof meterReadings.$inferSelect;
export type WorkOrder = typeof workOrders.$inferSelect;
export type StatusEvent = typeof statusEvents.$inferSelect;
export type Concern = typeof concerns.$inferSelect;
export type Finding = typeof findings.$inferSelect;
export type Photo = typeof photos.$inferSelect;
export type FindingReading = typeof findingReadings.$inferSelect;
export type EstimateLine = typeof estimateLines.$inferSelect;
export type DecisionRow = typeof decisions.$inferSelect;
export type AccountBudgetUse = typeof accountBudgetUse.$inferSelect;
export type TimeEntry = typeof timeEntries.$inferSelect;
export type Invoice = typeof invoices.$inferSelect;
export type InvoiceLine = typeof invoiceLines.$inferSelect;
export type Payment = typeof payments.$inferSelect;
export type Occurrence = typeof occurrences.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type ServiceRequest = typeof serviceRequests.$inferSelect;
