import type { LineState } from "@/lib/domain";
import { JOBS, SMALL_LINES } from "./catalogue";
import { amountOf, diagnosisTemplate, newLine, pickTemplates, priced, writeDecision, writeLines, type GenLine } from "./lines";
import type { Visit } from "./plan";
import { approverFor, lineContext, openSteps, poFor, writeVisitShell, type VisitContext } from "./visit-writer";
import { HOUR_MS, iso } from "./world";

/** A line of the approvals benchmark: proposed, at this version, for this approver to decide. */
export interface PoolLine {
  lineId: string;
  version: number;
  workOrderId: string;
  approverId: string;
}

const AFTER_APPROVAL: LineState[] = ["approved", "in_progress", "done"];

/** An open visit in its current state: lines waiting, approved or being worked as the status says. */
export async function writeOpenVisit(ctx: VisitContext, v: Visit): Promise<void> {
  const { rng } = ctx;
  const job = rng.pick(JOBS);
  const steps = openSteps(v, ctx.now);
  const { concernIds } = await writeVisitShell(ctx, v, {
    title: job.title,
    complaints: [{ complaint: job.complaint, cause: v.status === "checked_in" ? "" : job.cause, correction: "" }],
    steps, poNumber: poFor(rng, v, 0.3), findings: v.status === "checked_in" ? 0 : rng.int(1, 2),
  });
  const lines: GenLine[] = [];
  const diagAt = v.openedAt + HOUR_MS;
  if (v.status !== "checked_in") {
    lines.push(newLine(priced(rng, diagnosisTemplate(v.account.standingAuthorisationCents), v.openedAt, ctx.now), {
      isDiagnosis: true, byStanding: true, state: v.status === "diagnosing" ? "in_progress" : "done", version: 3, approvedAt: iso(diagAt),
    }));
  }
  if (v.status !== "checked_in" && v.status !== "diagnosing") {
    const waiting = v.status === "waiting_approval";
    const { templates } = pickTemplates(rng, rng.int(2, 7), 500_000);
    const late = v.status === "final_check" || v.status === "ready";
    for (const t of templates) {
      const state: LineState = waiting ? "proposed" : late ? "done" : rng.pick(AFTER_APPROVAL);
      lines.push(newLine(priced(rng, t, v.openedAt, ctx.now), { state, version: waiting ? 2 : 3 }));
    }
  }
  const approved = lines.filter((l) => !l.byStanding && l.state !== "proposed");
  const approver = approverFor(v, approved.reduce((s, l) => s + amountOf(l), 0));
  const decidedAt = iso(v.openedAt + 6 * HOUR_MS);
  const lc = lineContext(ctx, v, v.openedAt + HOUR_MS, ctx.now - HOUR_MS);
  for (const l of lines) {
    l.concernId = concernIds[0] ?? null;
    if (l.byStanding) await writeDecision(lc, l, { decision: "approve", byUserId: null, byStanding: true, lineVersion: 2, at: iso(diagAt) });
    else if (l.state !== "proposed") {
      l.approvedByUserId = approver;
      l.approvedAt = decidedAt;
      await writeDecision(lc, l, { decision: "approve", byUserId: approver, lineVersion: 2, at: decidedAt });
    }
  }
  await writeLines(lc, lines);
  ctx.left.lines -= lines.length;
  ctx.left.decisions -= lines.filter((l) => l.state !== "proposed").length;
}

/**
 * A township visit waiting on many small lines ($3–$60 each, at most ~$3,500
 * a visit): within the road supervisor's $5,000 signing limit, so either
 * township approver may decide every line of it.
 */
export async function writePoolVisit(ctx: VisitContext, v: Visit, lineCount: number, approverId: string): Promise<PoolLine[]> {
  const { rng } = ctx;
  const steps = openSteps(v, ctx.now);
  const { concernIds } = await writeVisitShell(ctx, v, {
    title: "Pre-season walk-around: small repairs",
    complaints: [{ complaint: "Pre-season walk-around before plowing.", cause: "Worn and broken small parts found on the walk-around.", correction: "" }],
    steps, poNumber: poFor(rng, v, 1), findings: 1,
  });
  const diagAt = iso(v.openedAt + HOUR_MS);
  const lines: GenLine[] = [newLine(priced(rng, diagnosisTemplate(v.account.standingAuthorisationCents), v.openedAt, ctx.now), {
    isDiagnosis: true, byStanding: true, state: "done", version: 3, approvedAt: diagAt, concernId: concernIds[0] ?? null,
  })];
  for (let i = 1; i < lineCount; i++) lines.push(newLine(priced(rng, SMALL_LINES[i % SMALL_LINES.length]!, v.openedAt, ctx.now), { concernId: concernIds[0] ?? null }));
  const waiting = lines.slice(1).reduce((sum, l) => sum + amountOf(l), 0);
  if (waiting > 450_000) throw new Error(`pool visit ${v.number} waits on ${waiting} cents, past the supervisor's signing limit`);
  const lc = lineContext(ctx, v, v.openedAt + HOUR_MS, ctx.now - HOUR_MS);
  await writeDecision(lc, lines[0]!, { decision: "approve", byUserId: null, byStanding: true, lineVersion: 2, at: diagAt });
  await writeLines(lc, lines);
  ctx.left.lines -= lines.length;
  ctx.left.decisions -= 1;
  return lines.slice(1).map((l) => ({ lineId: l.id, version: l.version, workOrderId: v.id, approverId }));
}

/**
 * The township's big visit waiting on approval: 250 lines over eight concerns
 * (a diagnosis under the standing authorisation, work the trustee approved,
 * lines the supervisor declined or held, and the rest waiting), six findings.
 */
export async function writeBigVisit(ctx: VisitContext, v: Visit, lineCount = 250): Promise<void> {
  const { rng } = ctx;
  const [supervisor, trustee] = v.account.approvers;
  if (!supervisor || !trustee) throw new Error("the township needs its two approvers");
  const complaints = JOBS.slice(0, 8).map((j) => ({ complaint: j.complaint, cause: j.cause, correction: "" }));
  const steps = openSteps(v, ctx.now);
  const { concernIds } = await writeVisitShell(ctx, v, {
    title: "Rebuild before winter: brakes, hydraulics, steering, electrical", complaints, steps, poNumber: poFor(rng, v, 1), findings: 6,
  });
  const diagAt = v.openedAt + HOUR_MS;
  const decidedAt = v.openedAt + 20 * HOUR_MS;
  const lines: GenLine[] = [newLine(priced(rng, diagnosisTemplate(v.account.standingAuthorisationCents), v.openedAt, ctx.now), {
    isDiagnosis: true, byStanding: true, state: "done", version: 3, approvedAt: iso(diagAt),
  })];
  // Nothing over about $350 a line, so the trustee's approvals stay inside the $25,000 signing limit.
  const { templates } = pickTemplates(rng, lineCount - 1, 25_000);
  templates.forEach((t, i) => {
    const state: LineState = i < 60 ? (i % 3 === 0 ? "in_progress" : "approved") : i < 80 ? "declined" : i < 90 ? "held" : "proposed";
    lines.push(newLine(priced(rng, t, v.openedAt, ctx.now), { state, version: state === "proposed" ? 2 : 3 }));
  });
  const lc = lineContext(ctx, v, v.openedAt + HOUR_MS, ctx.now - HOUR_MS);
  let decided = 0;
  for (const [i, l] of lines.entries()) {
    l.concernId = concernIds[i % concernIds.length] ?? null;
    if (l.byStanding) {
      await writeDecision(lc, l, { decision: "approve", byUserId: null, byStanding: true, lineVersion: 2, at: iso(diagAt) });
    } else if (l.state === "declined" || l.state === "held") {
      await writeDecision(lc, l, { decision: l.state === "declined" ? "decline" : "hold", byUserId: supervisor.id, lineVersion: 2, at: iso(decidedAt), note: "Next budget year." });
    } else if (l.state !== "proposed") {
      l.approvedByUserId = trustee.id;
      l.approvedAt = iso(decidedAt);
      await writeDecision(lc, l, { decision: "approve", byUserId: trustee.id, lineVersion: 2, at: iso(decidedAt) });
    } else continue;
    decided += 1;
  }
  await writeLines(lc, lines);
  ctx.left.lines -= lines.length;
  ctx.left.decisions -= decided;
}
