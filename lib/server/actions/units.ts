"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createUnit, importUnits, previewUnitImport, updateUnit } from "@/db/queries/unit-writes";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { unitCreateInput, unitEditFormInput, unitRetireInput } from "@/lib/validation/unit";

export const createUnitAction = guardedAction({ roles: CAN.manageAccounts, input: unitCreateInput }, async ({ user, input }) => {
  const row = await createUnit(user, input);
  revalidatePath("/units");
  return { unitId: row.id, unitNumber: row.unitNumber };
});

/** The edit form sends every field: an emptied one is cleared, an empty reading adds none. */
export const editUnitAction = guardedAction({ roles: CAN.manageAccounts, input: unitEditFormInput }, async ({ user, input }) => {
  const { unitId, odometer, engineHours, ...fields } = input;
  const cleared = Object.fromEntries(Object.entries(fields).map(([k, v]) => [k, v ?? null]));
  const row = await updateUnit(user, unitId, { ...cleared, odometer, engineHours });
  revalidatePath(`/units/${unitId}`);
  return { unitId: row.id, unitNumber: row.unitNumber };
});

export const retireUnitAction = guardedAction({ roles: CAN.manageAccounts, input: unitRetireInput }, async ({ user, input }) => {
  await updateUnit(user, input.unitId, { retired: input.retired });
  revalidatePath(`/units/${input.unitId}`);
  revalidatePath("/units");
  return { retired: input.retired };
});

const csvInput = z.object({ accountId: z.string().min(1).max(64), csv: z.string().min(1, "Choose a CSV file or paste its text.").max(1024 * 1024, "At most 1 MB.") });

export const previewImportAction = guardedAction({ roles: CAN.manageAccounts, input: csvInput }, async ({ input }) => previewUnitImport(input.accountId, input.csv));

export const importUnitsAction = guardedAction({ roles: CAN.manageAccounts, input: csvInput }, async ({ user, input }) => {
  const result = await importUnits(user, input.accountId, input.csv);
  revalidatePath("/units");
  return result;
});
