import { and, eq, inArray, isNull, ne, sql } from "drizzle-orm";
import { getDb, writeTx, type Reader, type Tx } from "@/db/client";
import { accounts, units } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { calendarDate } from "@/lib/format";
import { HttpError, invalidInput, notFound, type FieldProblem } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { annualInspectionDueDate } from "@/lib/specs";
import { allProblems, checkUnitCsv, type CsvCheck, type CsvProblem } from "@/lib/units/csv-import";
import { unitFields, unitRuleIssues, type UnitCreateInput, type UnitFieldsIn, type UnitPatchInput } from "@/lib/validation/unit";
import { fieldProblems } from "@/lib/http/zod-problems";
import { recordAudit } from "./audit";
import { recordFormReading } from "./meters";

type UnitRow = typeof units.$inferSelect;

/** The stored columns of a checked unit; the due date follows from the inspection and its basis (49 CFR 396.17). */
function toColumns(v: UnitFieldsIn, vin: string | null) {
  return {
    unitNumber: v.unitNumber,
    vin: v.serialOnly ? null : vin,
    serialOnly: v.serialOnly,
    serialNumber: v.serial ?? null,
    year: v.year ?? null,
    description: v.description,
    plate: v.plate,
    lastInspectionOn: v.lastInspectionOn ?? null,
    inspectionBasis: v.lastInspectionOn ? (v.inspectionBasis ?? null) : null,
    inspectionDueOn: v.lastInspectionOn && v.inspectionBasis ? annualInspectionDueDate(v.lastInspectionOn, v.inspectionBasis) : null,
    keyOffDrainLimitMa: v.keyOffDrainLimitMa ?? null,
  };
}

const today = () => calendarDate(new Date());

function checked(v: UnitFieldsIn): string | null {
  const { issues, vin } = unitRuleIssues(v, today());
  if (issues.length) throw invalidInput(issues);
  return vin;
}

async function assertAccountOpen(tx: Reader, accountId: string, named: "body" | "path" = "body") {
  const [account] = await tx.select({ id: accounts.id, archivedAt: accounts.archivedAt }).from(accounts).where(eq(accounts.id, accountId)).limit(1);
  // An id in the URL that names nothing is a 404; one in a form is a field to correct.
  if (!account && named === "path") throw notFound("That account");
  if (!account) throw invalidInput([{ path: "accountId", message: "That account does not exist." }]);
  if (account.archivedAt) throw invalidInput([{ path: "accountId", message: "That account is archived; bring it back to add units." }]);
}

/**
 * Unit numbers already in use on the account and VINs already on another unit
 * in service (a VIN names one vehicle). Retired units give their number back.
 */
async function conflicts(tx: Reader, accountId: string, wanted: { row: number; unitNumber: string; vin: string | null }[], exceptId?: string): Promise<CsvProblem[]> {
  if (wanted.length === 0) return [];
  const numbers = [...new Set(wanted.map((w) => w.unitNumber.toUpperCase()))];
  const vins = [...new Set(wanted.map((w) => w.vin).filter((v): v is string => Boolean(v)))];
  const [byNumber, byVin] = await Promise.all([
    tx
      .select({ unitNumber: units.unitNumber })
      .from(units)
      .where(and(eq(units.accountId, accountId), isNull(units.retiredAt), inArray(sql`upper(${units.unitNumber})`, numbers), exceptId ? ne(units.id, exceptId) : undefined)),
    vins.length
      ? tx
          .select({ vin: units.vin, unitNumber: units.unitNumber, accountName: accounts.name })
          .from(units)
          .innerJoin(accounts, eq(accounts.id, units.accountId))
          .where(and(inArray(units.vin, vins), isNull(units.retiredAt), exceptId ? ne(units.id, exceptId) : undefined))
      : Promise.resolve([]),
  ]);
  const taken = new Set(byNumber.map((r) => r.unitNumber.toUpperCase()));
  const vinOwner = new Map(byVin.map((r) => [r.vin, r]));
  const out: CsvProblem[] = [];
  for (const w of wanted) {
    if (taken.has(w.unitNumber.toUpperCase())) out.push({ row: w.row, field: "unitNumber", message: `This account already has a unit ${w.unitNumber}.` });
    const owner = w.vin ? vinOwner.get(w.vin) : undefined;
    if (owner) out.push({ row: w.row, field: "vin", message: `That VIN is already on unit ${owner.unitNumber} (${owner.accountName}).` });
  }
  return out;
}

const asFields = (problems: CsvProblem[]): FieldProblem[] => problems.map((p) => ({ path: p.field, message: p.message }));

async function insertUnit(tx: Tx, user: SessionUser, accountId: string, v: UnitFieldsIn, vin: string | null) {
  const [row] = await tx.insert(units).values({ accountId, ...toColumns(v, vin) }).returning();
  if (v.odometer !== undefined) await recordFormReading(tx, user, { unitId: row!.id, kind: "odometer", value: v.odometer, field: "odometer" });
  if (v.engineHours !== undefined) await recordFormReading(tx, user, { unitId: row!.id, kind: "engine_hours", value: v.engineHours, field: "engineHours" });
  return row!;
}

export async function createUnit(user: SessionUser, input: UnitCreateInput) {
  const vin = checked(input);
  return writeTx(async (tx) => {
    await assertAccountOpen(tx, input.accountId);
    const clash = await conflicts(tx, input.accountId, [{ row: 0, unitNumber: input.unitNumber, vin }]);
    if (clash.length) throw invalidInput(asFields(clash));
    const row = await insertUnit(tx, user, input.accountId, input, vin);
    await recordAudit(tx, user, { action: "unit.added", entityType: "unit", entityId: row.id, accountId: row.accountId, detail: { unitNumber: { from: null, to: row.unitNumber } } });
    return row;
  });
}

/** The stored unit as the fields a person would type (the starting point of a PATCH). */
export function fieldsOf(row: UnitRow): Record<string, unknown> {
  return {
    unitNumber: row.unitNumber,
    vin: row.vin ?? undefined,
    serialOnly: row.serialOnly,
    serial: row.serialNumber ?? undefined,
    year: row.year ?? undefined,
    description: row.description,
    plate: row.plate,
    lastInspectionOn: row.lastInspectionOn ?? undefined,
    inspectionBasis: row.inspectionBasis ?? undefined,
    keyOffDrainLimitMa: row.keyOffDrainLimitMa ?? undefined,
  };
}

const AUDITED = ["unitNumber", "vin", "serialOnly", "serialNumber", "year", "description", "plate", "lastInspectionOn", "inspectionBasis", "keyOffDrainLimitMa"] as const;

/**
 * Changes a unit: the patch is laid over the stored unit and checked whole,
 * by the same rules as a new one. `retired` takes it off every list (its
 * history stays); a later reading lower than the last is refused.
 */
export async function updateUnit(user: SessionUser, unitId: string, patch: UnitPatchInput) {
  return writeTx(async (tx) => {
    const [before] = await tx.select().from(units).where(eq(units.id, unitId)).limit(1);
    if (!before) throw notFound("That unit");
    const { retired, ...changes } = patch;
    const merged = { ...fieldsOf(before), ...Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined).map(([k, v]) => [k, v === null ? undefined : v])) };
    const parsed = unitFields.safeParse(merged);
    if (!parsed.success) throw invalidInput(fieldProblems(parsed.error));
    const vin = checked(parsed.data);
    const retiredAt = retired === undefined ? before.retiredAt : retired ? (before.retiredAt ?? nowIso()) : null;
    if (!retiredAt) {
      const clash = await conflicts(tx, before.accountId, [{ row: 0, unitNumber: parsed.data.unitNumber, vin }], before.id);
      if (clash.length) throw invalidInput(asFields(clash));
    }
    const next = toColumns(parsed.data, vin);
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    for (const c of AUDITED) if (before[c] !== next[c]) changed[c] = { from: before[c], to: next[c] };
    if (retiredAt !== before.retiredAt) changed.retired = { from: before.retiredAt !== null, to: retiredAt !== null };
    const [row] = await tx.update(units).set({ ...next, retiredAt, updatedAt: nowIso() }).where(eq(units.id, before.id)).returning();
    if (parsed.data.odometer !== undefined) await recordFormReading(tx, user, { unitId: before.id, kind: "odometer", value: parsed.data.odometer, field: "odometer" });
    if (parsed.data.engineHours !== undefined) await recordFormReading(tx, user, { unitId: before.id, kind: "engine_hours", value: parsed.data.engineHours, field: "engineHours" });
    if (Object.keys(changed).length) {
      await recordAudit(tx, user, { action: "unit.edited", entityType: "unit", entityId: before.id, accountId: before.accountId, detail: { unit: before.unitNumber, ...changed } });
    }
    return row!;
  });
}

/** A CSV file checked against itself and the account, nothing written: what the preview shows. */
export async function previewUnitImport(accountId: string, text: string): Promise<CsvCheck> {
  return withConflicts(getDb(), accountId, checkUnitCsv(text, today()));
}

async function withConflicts(tx: Reader, accountId: string, check: CsvCheck): Promise<CsvCheck> {
  await assertAccountOpen(tx, accountId, "path");
  const clash = await conflicts(tx, accountId, check.units.map((u) => ({ row: u.row, unitNumber: u.unitNumber, vin: u.normalizedVin })));
  if (!clash.length) return check;
  const bad = new Set(clash.map((c) => c.row));
  return {
    ...check,
    rows: check.rows.map((r) => ({ ...r, problems: [...r.problems, ...clash.filter((c) => c.row === r.row)] })),
    units: check.units.filter((u) => !bad.has(u.row)),
  };
}

/** Every row, or none: one problem anywhere refuses the whole file with each row's problems listed. */
export async function importUnits(user: SessionUser, accountId: string, text: string) {
  return writeTx(async (tx) => {
    const check = await withConflicts(tx, accountId, checkUnitCsv(text, today()));
    const problems = allProblems(check);
    if (problems.length) {
      throw new HttpError(400, "invalid_input", "Invalid input", `Nothing was imported: ${problems.length} problem${problems.length === 1 ? "" : "s"} in the file.`, problems.map((p) => ({ path: `row ${p.row}.${p.field}`, message: p.message, row: p.row, field: p.field })));
    }
    for (const u of check.units) await insertUnit(tx, user, accountId, u, u.normalizedVin);
    await recordAudit(tx, user, { action: "unit.imported", entityType: "account", entityId: accountId, accountId, detail: { created: true, unitsImported: { from: null, to: check.units.length } } });
    return { imported: check.units.length };
  });
}
