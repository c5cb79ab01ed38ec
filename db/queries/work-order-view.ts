import { getDb } from "@/db/client";
import type { SessionUser } from "@/lib/auth/session-user";
import { isStaff } from "@/lib/auth/policy";
import { limitsView, priceEstimate } from "@/lib/estimate";
import { decidedBy, lineOut } from "@/lib/records/estimate-line";
import { workOrderOut } from "@/lib/records/work-order";
import { budgetUsedCents } from "./budget-use";
import { currentFiscalYear, loadEstimateContext, toAccountSettings, toEstimateLine, toShopSettings } from "./estimate-context";
import { findWorkOrder, loadConcerns, loadFindings, loadLatestDecisions, loadTimeline } from "./work-order-detail";

/**
 * The whole work order as api-v1.md describes it (lines, totals, limits),
 * plus a few additive fields the pages use. Fleet people never see the shop's
 * draft lines. Null when the id does not exist or is another account's.
 */
export async function workOrderView(user: SessionUser, id: string) {
  const wo = await findWorkOrder(user, id);
  if (!wo) return null;
  const db = getDb();
  const ctx = await loadEstimateContext(db, user, wo.id);
  const bounds = currentFiscalYear(ctx.account);
  const [timeline, concerns, findings, decisions, used] = await Promise.all([
    loadTimeline(wo.id),
    loadConcerns(wo.id),
    loadFindings(wo.id),
    loadLatestDecisions(wo.id),
    budgetUsedCents(db, ctx.account.id, bounds),
  ]);
  const staff = isStaff(user);
  const rows = staff ? ctx.lines : ctx.lines.filter((l) => l.state !== "draft");
  const estimateLines = rows.map(toEstimateLine);
  const account = toAccountSettings(ctx.account);
  const pricing = priceEstimate(estimateLines, toShopSettings(ctx.shop), account);
  const caller = user.role === "approver" ? { id: user.id, signingLimitCents: user.signingLimitCents ?? 0 } : null;

  return {
    ...workOrderOut(wo),
    poNumber: wo.poNumber,
    unitNumber: wo.unitNumber,
    unitDescription: wo.unitDescription,
    accountName: wo.accountName,
    technicianName: wo.technicianName,
    clockedTechName: wo.clockedTechName,
    assignedTechId: wo.assignedTechId,
    timeline,
    concerns,
    findings: findings.map((f) => ({ ...f, photos: f.photos })),
    lines: rows.map((l) => {
      const d = decisions.latest.get(l.id);
      return lineOut(l, d ? { by: decidedBy(d), at: d.at, decision: d.decision, amountCents: d.amountCents, note: d.note, lineVersion: d.lineVersion } : null);
    }),
    totals: pricing.totals,
    estimateTotals: {
      ifAllPendingApprovedCents: pricing.ifAllPendingApproved.totalCents,
      coreCents: pricing.approved.coreCents,
      draftCents: pricing.byState.draft.amountCents,
    },
    limits: {
      ...limitsView({ lines: estimateLines, account, caller, budgetUsedCents: used }),
      budgetUsedCents: used,
      fiscalYear: bounds.fy.label,
    },
    decisionLog: decisions.all.map((d) => ({
      lineId: d.lineId,
      decision: d.decision,
      by: decidedBy(d),
      at: d.at,
      amountCents: d.amountCents,
      lineVersion: d.lineVersion,
      note: d.note,
    })),
  };
}

export type WorkOrderView = NonNullable<Awaited<ReturnType<typeof workOrderView>>>;
export type LineView = WorkOrderView["lines"][number];
