import { decisions, estimateLines } from "@/db/schema";
import type { Decision, LineState } from "@/lib/domain";
import { bulkId } from "./ids";
import { lineAmountCents } from "@/lib/money";
import type { BulkWriter } from "./bulk";
import { DIAGNOSIS_RATE, JOBS, SMALL_LINES, type LineTemplate } from "./catalogue";
import type { Rng } from "./rng";
import { DAY_MS, HISTORY_DAYS } from "./world";

/** A line as generated, before it becomes a row. */
export interface GenLine {
  id: string;
  template: LineTemplate;
  quantityMilli: number;
  unitPriceCents: number;
  isDiagnosis: boolean;
  state: LineState;
  version: number;
  approvedByUserId: string | null;
  byStanding: boolean;
  approvedAt: string | null;
  coreReturnedAt: string | null;
  concernId: string | null;
}

export const amountOf = (l: Pick<GenLine, "quantityMilli" | "unitPriceCents">) => lineAmountCents(l.quantityMilli, l.unitPriceCents);

/** Prices drift up over the years (older visits were cheaper) and vary a little per shop quote. */
export function priced(rng: Rng, t: LineTemplate, at: number, now: number): Pick<GenLine, "template" | "quantityMilli" | "unitPriceCents"> {
  const age = Math.min(1, (now - at) / (HISTORY_DAYS * DAY_MS));
  const factor = (1 - 0.15 * age) * (0.92 + rng.next() * 0.16);
  const labour = t.kind === "labor";
  return {
    template: t,
    // Labour hours vary with the job; part counts stay as quoted.
    quantityMilli: labour ? Math.max(100, Math.round((t.quantityMilli * (0.7 + rng.next() * 0.7)) / 100) * 100) : t.quantityMilli,
    unitPriceCents: labour ? Math.round(t.unitPriceCents * (1 - 0.15 * age)) : Math.max(5, Math.round((t.unitPriceCents * factor) / 5) * 5),
  };
}

/** `n` line templates for one visit: a main job, topped up from other jobs and small items. */
export function pickTemplates(rng: Rng, n: number, maxAmountCents = Number.POSITIVE_INFINITY): { jobIndex: number; templates: LineTemplate[] } {
  const jobIndex = rng.int(0, JOBS.length - 1);
  const fits = (t: LineTemplate) => lineAmountCents(t.quantityMilli, t.unitPriceCents) <= maxAmountCents;
  const templates = JOBS[jobIndex]!.lines.filter(fits).slice(0, n);
  while (templates.length < n) {
    const t = rng.chance(0.5) ? rng.pick(SMALL_LINES) : rng.pick(rng.pick(JOBS).lines);
    if (fits(t)) templates.push(t);
  }
  return { jobIndex, templates };
}

export function diagnosisTemplate(standingCents: number): LineTemplate {
  // As much diagnosis as the standing authorisation covers, in tenths of an hour, at most 1 h.
  const tenths = Math.max(3, Math.min(10, Math.floor((standingCents * 10) / DIAGNOSIS_RATE)));
  return { kind: "labor", description: "Diagnose and road-test; find the cause", quantityMilli: tenths * 100, unitPriceCents: DIAGNOSIS_RATE };
}

export function newLine(p: Pick<GenLine, "template" | "quantityMilli" | "unitPriceCents">, extra: Partial<GenLine> = {}): GenLine {
  return {
    id: bulkId(),
    ...p,
    isDiagnosis: false,
    state: "proposed",
    version: 2,
    approvedByUserId: null,
    byStanding: false,
    approvedAt: null,
    coreReturnedAt: null,
    concernId: null,
    ...extra,
  };
}

export interface LineContext {
  w: BulkWriter;
  workOrderId: string;
  accountId: string;
  writer: string;
  rates: { shop: string; diagnosis: string };
  createdAt: string;
  updatedAt: string;
}

export async function writeLines(ctx: LineContext, lines: GenLine[]): Promise<void> {
  for (const [position, l] of lines.entries()) {
    const approved = l.state === "approved" || l.state === "in_progress" || l.state === "done";
    await ctx.w.add(estimateLines, {
      id: l.id, workOrderId: ctx.workOrderId, concernId: l.concernId, findingId: null, position,
      kind: l.template.kind, description: l.template.description, partNumber: l.template.partNumber ?? "",
      quantityMilli: l.quantityMilli, unitPriceCents: l.unitPriceCents, taxable: l.template.kind === "part",
      coreChargeCents: l.template.coreChargeCents ?? 0, coreReturnedAt: l.coreReturnedAt,
      laborRateId: l.template.kind === "labor" ? (l.isDiagnosis ? ctx.rates.diagnosis : ctx.rates.shop) : null,
      isDiagnosis: l.isDiagnosis, state: l.state, version: l.version,
      approvedByUserId: approved ? l.approvedByUserId : null, byStanding: approved && l.byStanding,
      approvedAmountCents: approved ? amountOf(l) : null, approvedAt: approved ? l.approvedAt : null,
      reopenReason: null, deferredFromLineId: null, broughtBackAt: null, createdBy: ctx.writer,
      createdAt: ctx.createdAt, updatedAt: ctx.updatedAt,
    });
  }
}

export async function writeDecision(
  ctx: LineContext,
  line: GenLine,
  d: { decision: Decision; byUserId: string | null; byStanding?: boolean; lineVersion: number; at: string; note?: string },
): Promise<void> {
  await ctx.w.add(decisions, {
    id: bulkId(), lineId: line.id, workOrderId: ctx.workOrderId, accountId: ctx.accountId, decision: d.decision,
    byUserId: d.byUserId, byStanding: d.byStanding ?? false, amountCents: amountOf(line), lineVersion: d.lineVersion,
    note: d.note ?? "", at: d.at,
  });
}
