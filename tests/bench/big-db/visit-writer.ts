import { concerns, findings, meterReadings, statusEvents, workOrders } from "@/db/schema";
import { WORK_ORDER_STATUSES, type Severity, type WorkOrderStatus } from "@/lib/domain";
import { bulkId } from "./ids";
import type { BulkWriter } from "./bulk";
import { FINDING_NOTES, JOBS } from "./catalogue";
import type { DemoWorld } from "./demo";
import type { InvoiceWriter } from "./invoices";
import { amountOf, diagnosisTemplate, newLine, pickTemplates, priced, writeDecision, writeLines, type GenLine, type LineContext } from "./lines";
import type { Visit } from "./plan";
import type { Rng } from "./rng";
import { DAY_MS, HOUR_MS, iso } from "./world";

/** How many lines and decisions are still to write, so the totals land on the targets. */
export interface Remaining {
  lines: number;
  decisions: number;
  pastVisits: number;
}

export interface VisitContext {
  w: BulkWriter;
  rng: Rng;
  now: number;
  demo: DemoWorld;
  invoices: InvoiceWriter;
  left: Remaining;
}

export type Step = [WorkOrderStatus, number, string];

/** The visit's work-order row, its timeline, concern(s), findings and check-in meter readings. */
export async function writeVisitShell(
  ctx: VisitContext,
  v: Visit,
  o: { title: string; complaints: { complaint: string; cause: string; correction: string }[]; steps: Step[]; poNumber: string | null; findings: number },
): Promise<{ concernIds: string[]; tech: string }> {
  const { w, rng, demo } = ctx;
  const tech = rng.pick(demo.staff.techs);
  const last = o.steps.at(-1)!;
  const sent = o.steps.find((s) => s[0] === "waiting_approval");
  const released = v.status === "released";
  await w.add(workOrders, {
    id: v.id, number: v.number, unitId: v.unit.id, accountId: v.account.id, status: v.status, title: o.title,
    assignedTechId: v.status === "checked_in" ? null : tech,
    promisedAt: iso(v.openedAt + rng.int(2, 6) * DAY_MS), poNumber: o.poNumber, openedAt: iso(v.openedAt),
    sentForApprovalAt: sent ? iso(sent[1]) : null, releasedAt: released ? iso(last[1]) : null,
    createdBy: demo.staff.writer, createdAt: iso(v.openedAt), updatedAt: iso(last[1]),
  });
  for (const [status, at, note] of o.steps) {
    await w.add(statusEvents, { id: bulkId(), workOrderId: v.id, status, note, byUserId: status === "checked_in" || status === "released" ? demo.staff.writer : tech, at: iso(at) });
  }
  const concernIds: string[] = [];
  for (const [position, c] of o.complaints.entries()) {
    const id = bulkId();
    concernIds.push(id);
    await w.add(concerns, {
      id, unitId: v.unit.id, workOrderId: v.id, position, complaint: c.complaint, cause: c.cause, correction: c.correction,
      intermittent: false, recordHint: "", closedAt: null, conclusion: "", createdBy: demo.staff.writer, createdAt: iso(v.openedAt), updatedAt: iso(v.openedAt),
    });
  }
  for (let i = 0; i < o.findings; i++) {
    const at = iso(v.openedAt + (1 + i) * HOUR_MS);
    const severity: Severity = rng.chance(0.03) ? "out_of_service" : rng.pick(["fix_now", "plan", "plan", "note"] as const);
    await w.add(findings, {
      id: bulkId(), workOrderId: v.id, concernId: concernIds[i % concernIds.length] ?? null, title: `${rng.pick(JOBS).complaint.replace(/\.$/, "")} (finding ${i + 1})`,
      severity, noteMarkdown: rng.pick(FINDING_NOTES), createdBy: tech, createdAt: at, updatedAt: at,
    });
  }
  const days = (v.openedAt - (ctx.now - 6 * 365 * DAY_MS)) / DAY_MS;
  const readings: ["engine_hours" | "odometer", number][] = [["engine_hours", v.unit.hoursAtStart + v.unit.hoursPerDay * days]];
  if (v.unit.milesPerDay > 0) readings.push(["odometer", v.unit.milesAtStart + v.unit.milesPerDay * days]);
  for (const [kind, value] of readings) {
    await w.add(meterReadings, {
      id: bulkId(), unitId: v.unit.id, kind, value: Math.round(value), meterReplaced: false, readAt: iso(v.openedAt),
      workOrderId: v.id, recordedBy: demo.staff.writer, note: "", createdAt: iso(v.openedAt),
    });
  }
  return { concernIds, tech };
}

export function poFor(rng: Rng, v: Visit, chance: number): string | null {
  if (!v.account.poRequired && !rng.chance(chance)) return null;
  return `${v.account.poPrefix}-${new Date(v.openedAt).getUTCFullYear()}-${String(v.number % 10_000).padStart(4, "0")}`;
}

export function lineContext(ctx: VisitContext, v: Visit, createdAt: number, updatedAt: number): LineContext {
  return { w: ctx.w, workOrderId: v.id, accountId: v.account.id, writer: ctx.demo.staff.writer, rates: ctx.demo.rates, createdAt: iso(createdAt), updatedAt: iso(updatedAt) };
}

/** The approver whose signing limit covers `cents` on one work order (the highest one if none does). */
export function approverFor(v: Visit, cents: number): string | null {
  const list = v.account.approvers;
  return (list.find((a) => a.limitCents >= cents) ?? list.at(-1))?.id ?? null;
}

const DECLINE_NOTES = ["Not this year.", "Do it at the next PM.", "Budget is committed for this quarter.", ""];

/** A released visit: approved work done, some lines declined or held, two decisions on a few; then invoiced. */
export async function writePastVisit(ctx: VisitContext, v: Visit): Promise<void> {
  const { rng, left } = ctx;
  const mean = left.lines / Math.max(1, left.pastVisits);
  const n = left.pastVisits === 1 ? Math.max(2, left.lines) : Math.max(2, Math.min(18, Math.round(mean + rng.int(-4, 4))));
  const extraDecisions = Math.max(0, left.decisions - left.lines);
  const pDouble = left.lines > 0 ? extraDecisions / left.lines : 0;

  const t0 = v.openedAt;
  const wa = t0 + rng.int(3, 8) * HOUR_MS;
  const decided = wa + rng.int(1, 20) * HOUR_MS;
  const parts = rng.chance(0.25);
  const repairing = decided + (parts ? rng.int(24, 72) : 1) * HOUR_MS;
  const finalCheck = rng.chance(0.5);
  const ready = repairing + rng.int(4, 30) * HOUR_MS + (finalCheck ? 2 * HOUR_MS : 0);
  const releasedAt = Math.min(ready + rng.int(2, 48) * HOUR_MS, ctx.now - HOUR_MS);
  const steps: Step[] = [["checked_in", t0, "Unit checked in."], ["diagnosing", t0 + HOUR_MS, ""], ["waiting_approval", wa, "Estimate sent."]];
  if (parts) steps.push(["waiting_parts", decided + HOUR_MS, "Parts on order."]);
  steps.push(["repairing", repairing, ""]);
  if (finalCheck) steps.push(["final_check", ready - 2 * HOUR_MS, "Road test."]);
  steps.push(["ready", ready, "Ready for pickup."], ["released", releasedAt, "Released to the driver."]);

  const diag = rng.chance(0.5);
  const { jobIndex, templates } = pickTemplates(rng, diag ? n - 1 : n);
  const job = JOBS[jobIndex]!;
  const po = poFor(rng, v, 0.3);
  const { concernIds } = await writeVisitShell(ctx, v, {
    title: job.title, complaints: [job], steps, poNumber: po, findings: rng.chance(0.1) ? 1 : 0,
  });
  const lines: GenLine[] = [];
  if (diag) lines.push(newLine(priced(rng, diagnosisTemplate(v.account.standingAuthorisationCents), t0, ctx.now), { isDiagnosis: true, byStanding: true }));
  for (const t of templates) lines.push(newLine(priced(rng, t, t0, ctx.now)));
  // The first priced line is always done, so every past visit has something to invoice.
  lines.forEach((l, i) => {
    l.concernId = concernIds[0] ?? null;
    const r = rng.next();
    l.state = i <= (diag ? 1 : 0) || r >= 0.14 ? "done" : r < 0.08 ? "declined" : "held";
    l.version = 3;
  });
  const approvedTotal = lines.filter((l) => l.state === "done" && !l.byStanding).reduce((s, l) => s + amountOf(l), 0);
  const approver = approverFor(v, approvedTotal);
  const lc = lineContext(ctx, v, t0 + 2 * HOUR_MS, releasedAt);
  let decisionsWritten = 0;
  for (const l of lines) {
    if (l.byStanding) {
      l.approvedAt = iso(t0 + 2 * HOUR_MS);
      await writeDecision(lc, l, { decision: "approve", byUserId: null, byStanding: true, lineVersion: 2, at: l.approvedAt });
      decisionsWritten += 1;
      continue;
    }
    if (l.state === "done" && rng.chance(pDouble)) {
      // Held at first, approved once the fleet had looked again.
      await writeDecision(lc, l, { decision: "hold", byUserId: approver, lineVersion: 2, at: iso(wa + HOUR_MS), note: "Checking the budget first." });
      l.version = 4;
      decisionsWritten += 1;
    }
    l.approvedByUserId = l.state === "done" ? approver : null;
    l.approvedAt = l.state === "done" ? iso(decided) : null;
    if (l.state === "done" && l.template.coreChargeCents && rng.chance(0.5)) l.coreReturnedAt = iso(releasedAt);
    const decision = l.state === "done" ? "approve" : l.state === "declined" ? "decline" : "hold";
    await writeDecision(lc, l, { decision, byUserId: approver, lineVersion: l.version - 1, at: iso(decided), note: decision === "approve" ? "" : rng.pick(DECLINE_NOTES) });
    decisionsWritten += 1;
  }
  await writeLines(lc, lines);
  left.lines -= lines.length;
  left.decisions -= decisionsWritten;
  left.pastVisits -= 1;
  await ctx.invoices.add(v, lines, releasedAt, po);
}

/** Steps from check-in up to the visit's current status, spread from opening to an hour ago. */
export function openSteps(v: Visit, now: number): Step[] {
  const upto = WORK_ORDER_STATUSES.slice(0, WORK_ORDER_STATUSES.indexOf(v.status) + 1);
  const span = (now - HOUR_MS - v.openedAt) / Math.max(1, upto.length - 1);
  return upto.map((s, i) => [s, v.openedAt + span * i, i === 0 ? "Unit checked in." : s === "waiting_approval" ? "Estimate sent." : ""]);
}
