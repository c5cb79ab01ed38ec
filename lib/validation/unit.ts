import { z } from "zod";
import { INSPECTION_BASES } from "@/lib/domain";
import { validateVin } from "@/lib/vin";

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const checkbox = z.preprocess((v) => v === true || v === "on" || v === "true" || v === "yes" || v === "1", z.boolean());
const text = (max: number) => z.preprocess((v) => (v === null || v === undefined ? "" : typeof v === "number" ? String(v) : v), z.string().trim().max(max));
/** A number from JSON, or typed into a form or a CSV cell ("118,420" too); empty is "not given". */
const number = (schema: z.ZodNumber) =>
  z.preprocess((v) => {
    const b = blank(typeof v === "string" ? v.trim().replace(/,/g, "") : v);
    return typeof b === "string" ? Number(b) : b;
  }, schema.optional());
const isoDate = z.preprocess(blank, z.iso.date("Write the date as YYYY-MM-DD.").optional());

/** The next model year is already on sale; a truck older than 1900 is a museum piece. */
const maxYear = () => new Date().getUTCFullYear() + 2;

export const unitFieldShape = {
  unitNumber: z.preprocess((v) => (typeof v === "number" ? String(v) : v), z.string({ error: "Give the unit its fleet number." }).trim().min(1, "Give the unit its fleet number.").max(40)),
  vin: z.preprocess(blank, z.string().max(40).optional()),
  serialOnly: checkbox.default(false),
  serial: z.preprocess(blank, z.string().trim().max(60).optional()),
  year: number(z.number({ error: "The year is a number, like 2014." }).int("The year is a whole number.").min(1900, "That year is too early.").max(2100)),
  description: z.string({ error: "Describe the unit, e.g. tandem-axle dump with front plow." }).trim().min(1, "Describe the unit, e.g. tandem-axle dump with front plow.").max(300),
  plate: text(20).default(""),
  odometer: number(z.number({ error: "The odometer is a number of miles." }).min(0, "A reading cannot be negative.").max(9_999_999)),
  engineHours: number(z.number({ error: "Engine hours are a number." }).min(0, "A reading cannot be negative.").max(999_999)),
  lastInspectionOn: isoDate,
  inspectionBasis: z.preprocess(blank, z.enum(INSPECTION_BASES, { error: "Choose periodic (396.17(c)) or state (396.17(f))." }).optional()),
  keyOffDrainLimitMa: number(z.number({ error: "The drain figure is a number of milliamps." }).int("Whole milliamps.").min(1, "More than zero mA.").max(10_000, "At most 10,000 mA (10 A, the usual ammeter fuse).")),
};

export interface UnitFieldsIn {
  unitNumber: string;
  vin?: string | undefined;
  serialOnly: boolean;
  serial?: string | undefined;
  year?: number | undefined;
  description: string;
  plate: string;
  odometer?: number | undefined;
  engineHours?: number | undefined;
  lastInspectionOn?: string | undefined;
  inspectionBasis?: (typeof INSPECTION_BASES)[number] | undefined;
  keyOffDrainLimitMa?: number | undefined;
}

/**
 * Rules across a unit's fields. A VIN is checked by 49 CFR 565.15(c) (length,
 * characters, check digit: the message names the digit position 9 should
 * hold); "no VIN, serial only" is an explicit choice with its serial, never a
 * silent pass (reference-values.md). Returns the VIN as stored (upper case, no separators).
 */
export function unitRuleIssues(v: UnitFieldsIn, today: string): { issues: { path: string; message: string }[]; vin: string | null } {
  const issues: { path: string; message: string }[] = [];
  let vin: string | null = null;
  if (v.serialOnly) {
    if (v.vin) issues.push({ path: "vin", message: "A unit marked “no VIN, serial only” has no VIN: clear the VIN or untick “no VIN”." });
    if (!v.serial) issues.push({ path: "serial", message: "With no VIN, record the maker's serial number." });
  } else if (!v.vin) {
    issues.push({ path: "vin", message: "Enter the 17-character VIN, or choose “no VIN, serial only” and give the serial." });
  } else {
    const check = validateVin(v.vin);
    if (check.ok) vin = check.vin;
    else issues.push({ path: "vin", message: check.message });
  }
  if (v.year !== undefined && v.year > maxYear()) issues.push({ path: "year", message: "That year is in the future." });
  if (v.lastInspectionOn && v.lastInspectionOn > today) issues.push({ path: "lastInspectionOn", message: "The last inspection cannot be in the future." });
  if (v.lastInspectionOn && !v.inspectionBasis) issues.push({ path: "inspectionBasis", message: "Say which rule the inspection was under: periodic (396.17(c)) or a state program (396.17(f))." });
  return { issues, vin };
}

export const unitFields = z.object(unitFieldShape);

/** POST /api/v1/units and the add-a-unit form (the same names; strings from a form are coerced). */
export const unitCreateInput = z.object({ accountId: z.string().min(1, "Choose the fleet account.").max(64), ...unitFieldShape });
export type UnitCreateInput = z.output<typeof unitCreateInput>;

/**
 * PATCH /api/v1/units/:id: any field above (null clears an optional one), plus
 * `retired`. Values are checked once merged with the stored unit, by the same
 * schema and rules as a new unit, so a PATCH and a POST answer alike.
 */
export const unitPatchInput = z
  .object({
    ...(Object.fromEntries(Object.keys(unitFieldShape).map((k) => [k, z.unknown().optional()])) as Record<keyof typeof unitFieldShape, z.ZodOptional<z.ZodUnknown>>),
    retired: z.boolean().optional(),
  })
  .strict();
export type UnitPatchInput = z.output<typeof unitPatchInput>;

/** The edit form posts every field with its id. */
export const unitEditFormInput = z.object({ unitId: z.string().min(1).max(64), ...unitFieldShape });
export const unitRetireInput = z.object({ unitId: z.string().min(1).max(64), retired: z.boolean() });
