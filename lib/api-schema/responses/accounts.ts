import { z } from "zod";
import { INVOICE_STATUSES, PAYMENT_METHODS } from "@/lib/domain";
import { PAYMENT_STATE_LABELS, type PaymentState } from "@/lib/invoices/balance";
import { calendarDate, cents, id, instant, named, nextCursor } from "../components";
import { lineKind, role } from "./common";

export const accountSummary = named(
  "Account",
  z.object({
    id,
    name: z.string(),
    billingEmail: z.string(),
    address: z.string(),
    phone: z.string(),
    taxExempt: z.boolean(),
    taxExemptCertificate: z.string().nullable(),
    taxRatePct: z.number(),
    poRequired: z.boolean(),
    termsDays: z.number().int(),
    fiscalYearStartMonth: z.number().int().min(1).max(12),
    fiscalYear: z.string(),
    budgetCents: cents.nullable(),
    budgetRemainingCents: cents.nullable(),
    standingAuthorisationCents: cents,
    overrunPercent: z.number(),
    overrunFloorCents: cents,
    overrunCapCents: cents.nullable(),
    shopSuppliesExempt: z.boolean(),
    archived: z.boolean(),
    archivedAt: instant.nullable(),
    updatedAt: instant,
  }),
);

export const accountList = named("AccountList", z.object({ accounts: z.array(accountSummary), nextCursor }));

export const contact = named("Contact", z.object({ id, name: z.string(), role: z.string(), email: z.string(), phone: z.string(), billing: z.boolean() }));

export const accountDetail = named("AccountDetail", z.object({ ...accountSummary.shape, contacts: z.array(contact) }));

export const accountPatchResult = named(
  "AccountPatchResult",
  z.object({
    ...accountDetail.shape,
    changed: z.number().int().describe("How many fields changed (0: nothing did); each change is in the audit log with its old and new value."),
  }),
);

const invoiceStatus = z.enum(INVOICE_STATUSES);
// The keys of the labels the pages show, so a new state cannot be missed here.
const paymentState = z.enum(Object.keys(PAYMENT_STATE_LABELS) as [PaymentState, ...PaymentState[]]);

/** An invoice's own fields: what `invoiceOut` (lib/records/invoice.ts) answers; the list and the detail add theirs. */
export const invoiceFields = z.object({
  id,
  number: z.number().int(),
  label: z.string(),
  accountId: id,
  accountName: z.string(),
  workOrderId: id,
  workOrderNumber: z.string().describe('As people read it: "W-" and the number.'),
  poNumber: z.string().nullable(),
  status: invoiceStatus,
  paymentState,
  issuedAt: instant,
  dueAt: calendarDate.describe("The day it falls due, in the shop's time zone (YYYY-MM-DD)."),
  totalCents: cents,
  paidCents: cents,
  creditedCents: cents,
  balanceCents: cents,
});

export const invoiceSummary = named("InvoiceSummary", invoiceFields.extend({ unitNumber: z.string() }));

export const invoiceList = named("InvoiceList", z.object({ invoices: z.array(invoiceSummary), nextCursor }));

const paymentMethod = z.enum(PAYMENT_METHODS);
const invoiceRef = z.object({ id, number: z.number().int(), label: z.string() });

export const invoiceDetail = named(
  "InvoiceDetail",
  invoiceFields.extend({
    unitId: id,
    issuedOn: calendarDate,
    termsDays: z.number().int(),
    billTo: z.object({ accountName: z.string(), address: z.string(), email: z.string(), phone: z.string(), contactName: z.string() }),
    shop: z.object({ name: z.string(), addressLines: z.array(z.string()), phone: z.string(), email: z.string(), footer: z.string() }).nullable(),
    unit: z
      .object({
        unitNumber: z.string(),
        description: z.string(),
        year: z.number().int().nullable(),
        vin: z.string().nullable(),
        serialNumber: z.string().nullable(),
        workOrderNumber: z.number().int(),
        workOrderTitle: z.string(),
        concerns: z.array(z.object({ complaint: z.string(), cause: z.string(), correction: z.string() })).optional(),
      })
      .nullable(),
    taxExempt: z.boolean(),
    taxExemptCertificate: z.string().nullable(),
    taxRatePercent: z.number(),
    lines: z.array(
      z.object({
        id,
        kind: lineKind,
        description: z.string(),
        partNumber: z.string(),
        quantity: z.number(),
        quantityMilli: z.number().int(),
        unitPriceCents: cents,
        amountCents: cents,
        taxable: z.boolean(),
        coreChargeCents: cents,
      }),
    ),
    totals: z.object({
      laborCents: cents,
      partsCents: cents,
      subletCents: cents,
      feesCents: cents,
      shopSuppliesCents: cents,
      taxableCents: cents,
      taxCents: cents,
      coreCents: cents,
      totalCents: cents,
    }),
    payments: z.array(
      z.object({
        id,
        method: paymentMethod,
        amountCents: cents,
        reference: z.string(),
        receivedAt: instant,
        receivedOn: calendarDate,
        applied: z.boolean(),
        flagged: z.boolean(),
        flagReason: z.string().nullable(),
        resolution: z.enum(["applied", "returned"]).nullable(),
        recordedBy: z.string().nullable(),
      }),
    ),
    creditNotes: z.array(z.object({ id, label: z.string(), amountCents: cents, reason: z.string(), issuedAt: instant })),
    voidedAt: instant.nullable(),
    voidReason: z.string().nullable(),
    replaces: invoiceRef.nullable(),
    replacedBy: invoiceRef.nullable(),
  }),
);

export const checkout = named("Checkout", z.object({ url: z.string().describe("A payment page for the open balance.") }));

const ageing = z.object({ current: cents, days1to30: cents, days31to60: cents, days61to90: cents, over90: cents });

export const statement = named(
  "Statement",
  z.object({
    accountId: id,
    accountName: z.string(),
    asOf: calendarDate,
    timeZone: z.string(),
    totalDueCents: cents,
    ageing,
    invoices: z.array(
      z.object({
        ...invoiceSummary.shape,
        daysPastDue: z.number().int(),
        bucket: z.enum(["current", "days1to30", "days31to60", "days61to90", "over90"]),
      }),
    ),
    period: z.object({ from: calendarDate, to: calendarDate }),
    payments: z.array(
      z.object({
        id,
        invoiceId: id,
        invoiceNumber: z.number().int(),
        invoiceLabel: z.string(),
        method: paymentMethod,
        amountCents: cents,
        reference: z.string(),
        receivedAt: instant,
        status: z.enum(["applied", "returned", "held"]),
      }),
    ),
    paymentsInPeriodCents: cents,
  }),
);

export const me = named("Me", z.object({ id, name: z.string(), email: z.string(), role, accountId: id.nullable().describe("Null for shop staff.") }));

export const invitation = named("Invitation", z.object({ id, email: z.string(), role, expiresAt: instant }));

export const pendingInvitation = named(
  "PendingInvitation",
  z.object({
    id,
    email: z.string(),
    name: z.string(),
    role,
    accountId: id.nullable(),
    accountName: z.string().nullable(),
    signingLimitCents: cents.nullable(),
    expiresAt: instant,
    sentAt: instant,
    acceptedAt: instant.nullable(),
    withdrawnAt: instant.nullable(),
  }),
);

export const invitationList = named("InvitationList", z.object({ invitations: z.array(pendingInvitation) }));
export const withdrawnInvitation = named("WithdrawnInvitation", z.object({ id, email: z.string(), withdrawnAt: instant.nullable() }));
export const acceptedInvitation = named("AcceptedInvitation", z.object({ id, email: z.string(), role, accountId: id.nullable() }));
export const passwordChanged = named("PasswordChanged", z.object({ email: z.string() }));
export const resetRequested = named("ResetRequested", z.object({ status: z.literal("accepted"), detail: z.string() }));
export const setupDone = named("SetupDone", z.object({ owner: z.object({ id, email: z.string(), name: z.string() }) }));
export const health = named("Health", z.object({ status: z.literal("ok") }));
