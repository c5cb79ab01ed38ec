import { z } from "zod";
import { parsePercent } from "@/lib/money";
import { dollarsToCents } from "./estimate-line";

const checkbox = z.preprocess((v) => v === true || v === "on" || v === "true", z.boolean());
const blankToNull = (v: unknown) => (v === "" || v === null || v === undefined ? null : v);

/** A fleet account's settings, named as the columns are. Money in cents, percentages in thousandths of a percent. */
export interface AccountFields {
  name: string;
  billingEmail: string;
  address: string;
  phone: string;
  taxExempt: boolean;
  taxExemptCertificate: string | null;
  taxRateMilliPct: number;
  poRequired: boolean;
  paymentTermsDays: number;
  fiscalYearStartMonth: number;
  repairBudgetCents: number | null;
  standingAuthorisationCents: number;
  overrunPercentMilli: number;
  overrunFloorCents: number;
  overrunCapCents: number | null;
  shopSuppliesExempt: boolean;
}

/**
 * The default overrun allowance of a new account: the Florida shape, the
 * greater of $10 or 10 %, never more than $50 (Florida Statutes 559.909(1)(b),
 * reference-values.md). A contract setting, not legal advice for fleets.
 */
export const FLORIDA_OVERRUN = { overrunPercentMilli: 10_000, overrunFloorCents: 1_000, overrunCapCents: 5_000 } as const;

export interface ContactFields {
  name: string;
  title: string;
  email: string;
  phone: string;
  isBilling: boolean;
}

/** Rules across fields, checked on the whole account (after a PATCH is merged too); keys are column names. */
export function accountRuleProblems(f: AccountFields): { column: keyof AccountFields; message: string }[] {
  const out: { column: keyof AccountFields; message: string }[] = [];
  if (f.taxExempt && !f.taxExemptCertificate) out.push({ column: "taxExemptCertificate", message: "A tax-exempt account needs its certificate number on file." });
  if (f.overrunCapCents !== null && f.overrunFloorCents > f.overrunCapCents) out.push({ column: "overrunFloorCents", message: "The floor cannot be above the cap." });
  return out;
}

/** The form's field names (dollars) and the API's (cents) for each column, so field errors land where they were typed. */
export const FORM_NAMES: Record<keyof AccountFields, string> = {
  name: "name",
  billingEmail: "billingEmail",
  address: "address",
  phone: "phone",
  taxExempt: "taxExempt",
  taxExemptCertificate: "taxExemptCertificate",
  taxRateMilliPct: "taxRate",
  poRequired: "poRequired",
  paymentTermsDays: "paymentTermsDays",
  fiscalYearStartMonth: "fiscalYearStartMonth",
  repairBudgetCents: "repairBudget",
  standingAuthorisationCents: "standingAuthorisation",
  overrunPercentMilli: "overrunPercent",
  overrunFloorCents: "overrunFloor",
  overrunCapCents: "overrunCap",
  shopSuppliesExempt: "shopSuppliesExempt",
};
export const API_NAMES: Record<keyof AccountFields, string> = {
  ...FORM_NAMES,
  taxRateMilliPct: "taxRatePct",
  paymentTermsDays: "termsDays",
  repairBudgetCents: "budgetCents",
  standingAuthorisationCents: "standingAuthorisationCents",
  overrunPercentMilli: "overrunPercent",
  overrunFloorCents: "overrunFloorCents",
  overrunCapCents: "overrunCapCents",
};

const percentMilli = (label: string) =>
  z.preprocess(
    (v) => (typeof v === "number" ? String(v) : v),
    z.string().transform((s, ctx) => {
      const milli = parsePercent(s);
      if (milli === null || milli < 0 || milli > 100_000) {
        ctx.addIssue({ code: "custom", message: `${label} is a percent from 0 to 100, with up to 3 decimals.` });
        return z.NEVER;
      }
      return milli;
    }),
  );

const money = dollarsToCents.pipe(z.number().int().min(0, "Amounts cannot be negative.").max(10_000_000_000));
const optionalMoney = z.preprocess(blankToNull, money.nullable());
const cents = z.number().int().min(0, "Amounts cannot be negative.").max(10_000_000_000);
const text = (max: number) => z.string().trim().max(max);
const accountName = z.string().trim().min(1, "The account needs a name.").max(160);
const billingEmail = z.string().trim().toLowerCase().email("Invoices go to this address: enter an e-mail.").max(200);

function addRuleIssues(fields: AccountFields, names: Record<keyof AccountFields, string>, ctx: z.RefinementCtx) {
  for (const p of accountRuleProblems(fields)) ctx.addIssue({ code: "custom", path: [names[p.column]], message: p.message });
}

/** The shop's form for a new or existing account (dollars typed by a person). */
export const accountFormInput = z
  .object({
    accountId: z.preprocess((v) => (v === "" ? undefined : v), z.string().min(1).max(64).optional()),
    name: accountName,
    billingEmail,
    address: text(400).default(""),
    phone: text(40).default(""),
    standingAuthorisation: money,
    repairBudget: optionalMoney,
    fiscalYearStartMonth: z.coerce.number().int().min(1).max(12),
    overrunPercent: percentMilli("The overrun allowance"),
    overrunCap: optionalMoney,
    overrunFloor: z.preprocess((v) => (v === "" || v === undefined ? "0" : v), money),
    taxExempt: checkbox.default(false),
    taxExemptCertificate: text(80).default(""),
    taxRate: percentMilli("The tax rate"),
    poRequired: checkbox.default(false),
    paymentTermsDays: z.coerce.number().int().min(0, "Terms cannot be negative.").max(365),
    shopSuppliesExempt: checkbox.default(false),
  })
  .transform((v): { accountId?: string; fields: AccountFields } => ({
    accountId: v.accountId,
    fields: {
      name: v.name,
      billingEmail: v.billingEmail,
      address: v.address,
      phone: v.phone,
      taxExempt: v.taxExempt,
      taxExemptCertificate: v.taxExemptCertificate || null,
      taxRateMilliPct: v.taxRate,
      poRequired: v.poRequired,
      paymentTermsDays: v.paymentTermsDays,
      fiscalYearStartMonth: v.fiscalYearStartMonth,
      repairBudgetCents: v.repairBudget,
      standingAuthorisationCents: v.standingAuthorisation,
      overrunPercentMilli: v.overrunPercent,
      overrunFloorCents: v.overrunFloor,
      overrunCapCents: v.overrunCap,
      shopSuppliesExempt: v.shopSuppliesExempt,
    },
  }))
  .superRefine((v, ctx) => addRuleIssues(v.fields, FORM_NAMES, ctx));
export type AccountFormInput = z.output<typeof accountFormInput>;

export const contactInput = z.object({
  name: z.string().trim().min(1, "Name the contact.").max(120),
  role: text(80).default(""),
  email: z.preprocess((v) => (v === null ? "" : v), z.union([z.literal(""), z.string().trim().toLowerCase().email("Enter an e-mail address, or leave it empty.").max(200)])).default(""),
  phone: text(40).default(""),
  billing: checkbox.default(false),
});
export const contactsInput = z.array(contactInput).max(50, "At most 50 contacts.");
export const toContactFields = (c: z.output<typeof contactInput>): ContactFields => ({ name: c.name, title: c.role, email: c.email, phone: c.phone, isBilling: c.billing });

/** The API's percent numbers (10, 6.625) to thousandths of a percent, refusing a fourth decimal. */
const apiPercent = z
  .number()
  .min(0)
  .max(100)
  .transform((n, ctx) => {
    const milli = Math.round(n * 1000);
    if (Math.abs(n * 1000 - milli) > 1e-6) {
      ctx.addIssue({ code: "custom", message: "A percent with at most 3 decimals." });
      return z.NEVER;
    }
    return milli;
  });

const apiFields = {
  name: accountName,
  billingEmail,
  address: text(400),
  phone: text(40),
  taxExempt: z.boolean(),
  taxExemptCertificate: text(80).nullable(),
  taxRatePct: apiPercent,
  poRequired: z.boolean(),
  termsDays: z.number().int().min(0).max(365),
  fiscalYearStartMonth: z.number().int().min(1).max(12),
  budgetCents: cents.nullable(),
  standingAuthorisationCents: cents,
  overrunPercent: apiPercent,
  overrunFloorCents: cents,
  overrunCapCents: cents.nullable(),
  shopSuppliesExempt: z.boolean(),
};

type ApiFields = { [K in keyof typeof apiFields]: z.output<(typeof apiFields)[K]> };

function fromApi(v: Partial<ApiFields>): Partial<AccountFields> {
  const out: Partial<AccountFields> = {};
  const set = <K extends keyof AccountFields>(k: K, value: AccountFields[K] | undefined) => {
    if (value !== undefined) out[k] = value;
  };
  set("name", v.name);
  set("billingEmail", v.billingEmail);
  set("address", v.address);
  set("phone", v.phone);
  set("taxExempt", v.taxExempt);
  set("taxExemptCertificate", v.taxExemptCertificate === undefined ? undefined : v.taxExemptCertificate || null);
  set("taxRateMilliPct", v.taxRatePct);
  set("poRequired", v.poRequired);
  set("paymentTermsDays", v.termsDays);
  set("fiscalYearStartMonth", v.fiscalYearStartMonth);
  set("repairBudgetCents", v.budgetCents);
  set("standingAuthorisationCents", v.standingAuthorisationCents);
  set("overrunPercentMilli", v.overrunPercent);
  set("overrunFloorCents", v.overrunFloorCents);
  set("overrunCapCents", v.overrunCapCents);
  set("shopSuppliesExempt", v.shopSuppliesExempt);
  return out;
}

/** POST /api/v1/accounts: what is left out takes the defaults of a new account (the Florida overrun shape among them). */
export const accountCreateApiInput = z
  .object({
    name: apiFields.name,
    billingEmail: apiFields.billingEmail,
    address: apiFields.address.default(""),
    phone: apiFields.phone.default(""),
    taxExempt: apiFields.taxExempt.default(false),
    taxExemptCertificate: apiFields.taxExemptCertificate.default(null),
    taxRatePct: apiFields.taxRatePct.default(0),
    poRequired: apiFields.poRequired.default(false),
    termsDays: apiFields.termsDays.default(30),
    fiscalYearStartMonth: apiFields.fiscalYearStartMonth.default(1),
    budgetCents: apiFields.budgetCents.default(null),
    standingAuthorisationCents: apiFields.standingAuthorisationCents.default(0),
    // zod's default on a transformed field is the output: thousandths of a percent.
    overrunPercent: apiFields.overrunPercent.default(FLORIDA_OVERRUN.overrunPercentMilli),
    overrunFloorCents: apiFields.overrunFloorCents.default(FLORIDA_OVERRUN.overrunFloorCents),
    overrunCapCents: apiFields.overrunCapCents.default(FLORIDA_OVERRUN.overrunCapCents),
    shopSuppliesExempt: apiFields.shopSuppliesExempt.default(false),
    contacts: contactsInput.default([]),
  })
  .transform(({ contacts, ...v }) => ({ fields: fromApi(v) as AccountFields, contacts: contacts.map(toContactFields) }))
  .superRefine((v, ctx) => addRuleIssues(v.fields, API_NAMES, ctx));

/** PATCH /api/v1/accounts/:id: any field; rules across fields are checked once merged with the stored account. */
export const accountPatchApiInput = z
  .object({
    name: apiFields.name.optional(),
    billingEmail: apiFields.billingEmail.optional(),
    address: apiFields.address.optional(),
    phone: apiFields.phone.optional(),
    taxExempt: apiFields.taxExempt.optional(),
    taxExemptCertificate: apiFields.taxExemptCertificate.optional(),
    taxRatePct: apiFields.taxRatePct.optional(),
    poRequired: apiFields.poRequired.optional(),
    termsDays: apiFields.termsDays.optional(),
    fiscalYearStartMonth: apiFields.fiscalYearStartMonth.optional(),
    budgetCents: apiFields.budgetCents.optional(),
    standingAuthorisationCents: apiFields.standingAuthorisationCents.optional(),
    overrunPercent: apiFields.overrunPercent.optional(),
    overrunFloorCents: apiFields.overrunFloorCents.optional(),
    overrunCapCents: apiFields.overrunCapCents.optional(),
    shopSuppliesExempt: apiFields.shopSuppliesExempt.optional(),
    contacts: contactsInput.optional(),
    archived: z.boolean().optional(),
  })
  .strict()
  .transform(({ contacts, archived, ...v }) => ({ fields: fromApi(v), contacts: contacts?.map(toContactFields), archived }));

export const signingLimitInput = z.object({
  userId: z.string().min(1).max(64),
  signingLimit: money,
});

export const accountRefInput = z.object({ accountId: z.string().min(1).max(64), archived: z.boolean() });
export const accountContactsInput = z.object({ accountId: z.string().min(1).max(64), contacts: contactsInput });
