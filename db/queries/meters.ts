import { and, desc, eq } from "drizzle-orm";
import { writeTx, type Tx } from "@/db/client";
import { meterReadings, units } from "@/db/schema";
import { isStaff } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";
import { nowIso } from "@/lib/ids";
import { checkMeterReading } from "@/lib/meters";
import { forbidden, invalidInput, notFound } from "@/lib/http/problem";
import type { MeterKind } from "@/lib/domain";
import type { MeterReadingInput } from "@/lib/validation/meter-reading";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

/** Adds a reading after checking it against the latest one, in one transaction. */
export async function addMeterReading(user: SessionUser, unitId: string, input: MeterReadingInput) {
  return writeTx(async (tx) => {
    const [unit] = await tx
      .select({ id: units.id, accountId: units.accountId })
      .from(units)
      .where(and(eq(units.id, unitId), scopedTo(units.accountId, user)))
      .limit(1);
    if (!unit) throw notFound("That unit");
    // A lower reading is accepted only with a replaced meter, so saying so is the shop's call (it is audited).
    if (input.meterReplaced && !isStaff(user)) throw forbidden("Only the shop records a replaced meter. Tell the shop the meter was changed.");

    const previous = await latestReading(tx, unitId, input.kind);

    const check = checkMeterReading(input.kind, previous, input);
    if (!check.ok) throw invalidInput([{ path: "value", message: check.message }], check.message);

    const readAt = input.readAt ?? nowIso();
    const [row] = await tx
      .insert(meterReadings)
      .values({
        unitId,
        kind: input.kind,
        value: input.value,
        meterReplaced: input.meterReplaced,
        readAt,
        recordedBy: user.id,
        note: input.note,
      })
      .returning();
    await tx.update(units).set({ updatedAt: nowIso() }).where(eq(units.id, unitId));
    if (input.meterReplaced) {
      await recordAudit(tx, user, {
        action: "meter.replaced",
        entityType: "unit",
        entityId: unitId,
        accountId: unit.accountId,
        detail: { kind: input.kind, previous: previous?.value ?? null, value: input.value },
      });
    }
    return row!;
  });
}

/** The unit's latest reading of a meter, or null. */
export async function latestReading(tx: Tx, unitId: string, kind: MeterKind) {
  const [previous] = await tx
    .select({ value: meterReadings.value, readAt: meterReadings.readAt })
    .from(meterReadings)
    .where(and(eq(meterReadings.unitId, unitId), eq(meterReadings.kind, kind)))
    .orderBy(desc(meterReadings.readAt), desc(meterReadings.createdAt))
    .limit(1);
  return previous ?? null;
}

/**
 * A reading typed into a unit or check-in form, inside the caller's write: the
 * lower-reading rule applies (a replaced meter is recorded on the unit's page),
 * the same value as the last reading adds nothing, and a refusal names `field`.
 */
export async function recordFormReading(
  tx: Tx,
  user: SessionUser,
  r: { unitId: string; kind: MeterKind; value: number; field: string; workOrderId?: string; note?: string },
) {
  const previous = await latestReading(tx, r.unitId, r.kind);
  if (previous?.value === r.value) return;
  const check = checkMeterReading(r.kind, previous, { value: r.value, meterReplaced: false });
  if (!check.ok) throw invalidInput([{ path: r.field, message: check.message }], check.message);
  await tx.insert(meterReadings).values({ unitId: r.unitId, workOrderId: r.workOrderId ?? null, kind: r.kind, value: r.value, readAt: nowIso(), recordedBy: user.id, note: r.note ?? "" });
}
