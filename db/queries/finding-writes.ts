import { and, eq, inArray, isNull, max } from "drizzle-orm";
import { getDb, writeTx, type Tx } from "@/db/client";
import { concerns, estimateLines, findingReadings, findings, laborRates, photos, shopSettings, units, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import type { LineKind } from "@/lib/domain";
import { conflict, invalidInput, notFound, type FieldProblem } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { toMilli } from "@/lib/money";
import { tryCheckReading, type ReadingInput, type ReadingResult } from "@/lib/specs";
import type { FindingInput, ReadingEntry } from "@/lib/validation/finding";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

interface Checked {
  entry: ReadingEntry;
  input: ReadingInput;
  result: ReadingResult;
}

/**
 * Fills what the server knows better than the phone: today's date for the
 * inspection check, and the unit's own key-off drain figure when none was typed.
 */
function withServerFacts(input: ReadingInput, facts: { today: string; unitDrainLimitMa: number | null }): ReadingInput {
  if (input.kind === "annual_inspection") return { ...input, today: facts.today };
  if (input.kind === "key_off_drain" && input.unitLimitMa === undefined && facts.unitDrainLimitMa !== null) {
    return { ...input, unitLimitMa: facts.unitDrainLimitMa };
  }
  return input;
}

/** Verdicts are worked out here, from the typed input alone (lib/specs); nothing the client says about them is used. */
export function checkReadings(entries: readonly ReadingEntry[], facts: { today: string; unitDrainLimitMa: number | null }): Checked[] {
  const problems: FieldProblem[] = [];
  const checked: Checked[] = [];
  entries.forEach((entry, i) => {
    const input = withServerFacts(entry.input, facts);
    const outcome = tryCheckReading(input);
    if (outcome.ok) checked.push({ entry, input, result: outcome.result });
    else problems.push({ path: `readings.${i}`, message: outcome.message });
  });
  if (problems.length) throw invalidInput(problems, "A reading could not be checked.");
  return checked;
}

async function loadTarget(user: SessionUser, workOrderId: string) {
  const [wo] = await getDb()
    .select({
      id: workOrders.id,
      accountId: workOrders.accountId,
      unitId: workOrders.unitId,
      status: workOrders.status,
      unitDrainLimitMa: units.keyOffDrainLimitMa,
    })
    .from(workOrders)
    .innerJoin(units, eq(units.id, workOrders.unitId))
    .where(and(eq(workOrders.id, workOrderId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  if (!wo) throw notFound("That work order");
  if (wo.status === "released") throw conflict("work_order_closed", "This visit is closed (released); findings can no longer be added.");
  return wo;
}

/**
 * Posts a finding with its readings, attaches the technician's photos and
 * writes any proposed estimate lines as drafts for the writer to price: all in
 * one transaction, or nothing.
 */
export async function createFinding(user: SessionUser, workOrderId: string, input: FindingInput, today: string) {
  const wo = await loadTarget(user, workOrderId);
  const checked = checkReadings(input.readings, { today, unitDrainLimitMa: wo.unitDrainLimitMa });
  const at = nowIso();

  return writeTx(async (tx) => {
    if (input.concernId) {
      const [concern] = await tx
        .select({ id: concerns.id })
        .from(concerns)
        .where(and(eq(concerns.id, input.concernId), eq(concerns.workOrderId, wo.id)))
        .limit(1);
      if (!concern) throw invalidInput([{ path: "concernId", message: "That concern is not on this work order." }]);
    }
    if (input.photoIds.length) {
      const mine = await tx
        .select({ id: photos.id })
        .from(photos)
        .where(
          and(
            inArray(photos.id, input.photoIds),
            eq(photos.workOrderId, wo.id),
            eq(photos.uploadedBy, user.id),
            isNull(photos.findingId),
          ),
        );
      if (mine.length !== input.photoIds.length) {
        throw invalidInput([{ path: "photoIds", message: "Some photos are not your own new uploads on this work order." }]);
      }
    }

    const [finding] = await tx
      .insert(findings)
      .values({
        workOrderId: wo.id,
        concernId: input.concernId ?? null,
        title: input.title,
        severity: input.severity,
        noteMarkdown: input.noteMarkdown,
        createdBy: user.id,
        createdAt: at,
        updatedAt: at,
      })
      .returning({ id: findings.id });
    if (!finding) throw new Error("finding insert returned nothing");

    if (checked.length) {
      await tx.insert(findingReadings).values(
        checked.map(({ entry, input: typed, result }, position) => ({
          findingId: finding.id,
          position,
          kind: result.kind,
          location: entry.location,
          input: typed,
          value: result.value,
          unit: result.unit,
          verdict: result.verdict,
          limitText: result.limit,
          limitValue: result.limitValue,
          source: result.source,
          sourceKind: result.sourceKind,
          note: result.note ?? "",
          createdAt: at,
        })),
      );
    }
    if (input.photoIds.length) {
      await tx.update(photos).set({ findingId: finding.id }).where(inArray(photos.id, input.photoIds));
    }
    const lineIds = await insertProposedLines(tx, user, wo.id, finding.id, input);
    // The fleet's live pages look at updatedAt to see that something changed.
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, wo.id));
    await recordAudit(tx, user, {
      action: "finding.posted",
      entityType: "finding",
      entityId: finding.id,
      accountId: wo.accountId,
      detail: { workOrderId: wo.id, severity: input.severity, photos: input.photoIds.length, readings: checked.length, lines: lineIds.length },
    });
    return { id: finding.id, workOrderId: wo.id, proposedLineIds: lineIds };
  });
}

async function insertProposedLines(tx: Tx, user: SessionUser, workOrderId: string, findingId: string, input: FindingInput): Promise<string[]> {
  if (!input.proposedLines.length) return [];
  const [settings] = await tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).limit(1);
  const [rate] = await tx
    .select({ id: laborRates.id, rateCents: laborRates.rateCents })
    .from(laborRates)
    .where(and(eq(laborRates.isDefault, true), eq(laborRates.active, true)))
    .limit(1);
  const [last] = await tx
    .select({ position: max(estimateLines.position) })
    .from(estimateLines)
    .where(eq(estimateLines.workOrderId, workOrderId));
  const taxable: Record<LineKind, boolean> = {
    labor: settings?.taxLabor ?? false,
    part: settings?.taxParts ?? true,
    sublet: settings?.taxSublet ?? false,
    fee: settings?.taxFees ?? false,
  };
  const start = (last?.position ?? -1) + 1;
  const rows = await tx
    .insert(estimateLines)
    .values(
      input.proposedLines.map((line, i) => ({
        workOrderId,
        concernId: input.concernId ?? null,
        findingId,
        position: start + i,
        kind: line.kind,
        description: line.description,
        quantityMilli: toMilli(line.quantity),
        // Labour starts at the shop's default rate; parts, sublet and fees wait for the writer's price.
        unitPriceCents: line.kind === "labor" ? (rate?.rateCents ?? 0) : 0,
        laborRateId: line.kind === "labor" ? (rate?.id ?? null) : null,
        taxable: taxable[line.kind],
        state: "draft" as const,
        createdBy: user.id,
      })),
    )
    .returning({ id: estimateLines.id });
  return rows.map((r) => r.id);
}
