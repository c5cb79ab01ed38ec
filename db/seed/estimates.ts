import { eq as eqSql } from "drizzle-orm";
import { recountBudgetUsed } from "@/db/queries/budget-use";
import { currentFiscalYear } from "@/db/queries/estimate-context";
import { accounts, decisions, estimateLines, timeEntries, workOrders } from "@/db/schema";
import type { Decision, LineKind, LineState } from "@/lib/domain";
import { lineAmountCents } from "@/lib/money";
import { type SeedContext, id, laterInShopHours, milestones, nextMilestone } from "./context";

type By = "standing" | "supervisor" | "trustee" | "transport" | "office";
const APPROVER_EMAIL: Record<Exclude<By, "standing">, string> = {
  supervisor: "supervisor@brennan-twp.example",
  trustee: "trustee@brennan-twp.example",
  transport: "transport@alder-falls-schools.example",
  office: "office@kettle-ridge.example",
};

interface LineSeed {
  concern?: number;
  kind: LineKind;
  description: string;
  qty: number; // thousandths
  price: number; // cents
  taxable?: boolean;
  core?: number;
  state: LineState;
  by?: By;
  note?: string;
  diagnosis?: boolean;
  partNumber?: string;
}

const L = (kind: LineKind, description: string, qty: number, price: number, state: LineState, extra: Partial<LineSeed> = {}): LineSeed => ({
  kind,
  description,
  qty,
  price,
  state,
  taxable: kind === "part",
  ...extra,
});

/** Estimates on the open visits, chosen so every limit shows on first start (issue: estimates and decisions). */
const ESTIMATES: Record<string, LineSeed[]> = {
  "W-1042": [
    L("labor", "Diagnose plow drift and steering wander", 1000, 15_500, "done", { concern: 0, by: "standing", diagnosis: true }),
    L("labor", "Remove, hone and reseal plow lift cylinder", 4500, 14_250, "proposed", { concern: 0 }),
    L("part", "Lift cylinder seal kit, 3 in bore", 1000, 18_640, "proposed", { concern: 0, partNumber: "SK-30-114" }),
    L("part", "Hydraulic fluid, AW-32 (gal)", 5000, 1_485, "proposed", { concern: 0 }),
    L("part", "Moldboard and cutting-edge assembly, 11 ft reversible", 1000, 564_000, "proposed", { concern: 0, partNumber: "MB-11R-02" }),
    L("labor", "Replace drag link and both tie-rod ends", 3800, 14_250, "proposed", { concern: 1 }),
    L("part", "Drag link, adjustable", 1000, 41_290, "proposed", { concern: 1, core: 2_500, partNumber: "DL-7731" }),
    L("part", "Tie-rod end", 2000, 13_875, "proposed", { concern: 1, partNumber: "TRE-2210" }),
    L("sublet", "Front-end alignment (alignment shop)", 1000, 18_500, "proposed", { concern: 1 }),
    L("labor", "Annual inspection (49 CFR 396.17)", 2000, 14_250, "proposed", { concern: 2 }),
    L("part", "Front brake chamber, type 24", 2000, 9_680, "proposed", { concern: 2, partNumber: "BC-24-S" }),
  ],
  "W-1043": [
    L("labor", "Diagnose no-start: battery, cranking and key-off drain tests", 2000, 15_500, "in_progress", { concern: 0, by: "supervisor", diagnosis: true }),
  ],
  "W-1044": [
    L("labor", "Diagnose brake stroke and slack adjusters", 500, 15_500, "done", { concern: 0, by: "standing", diagnosis: true }),
    L("labor", "Replace right rear slack adjuster, adjust all wheel ends", 1500, 14_250, "proposed", { concern: 0 }),
    L("part", "Automatic slack adjuster, 5.5 in arm", 1000, 16_420, "proposed", { concern: 0, partNumber: "ASA-55-R" }),
    L("part", "Rear brake shoes and drums, both sides", 1000, 188_000, "proposed", { concern: 0, partNumber: "BSD-165" }),
  ],
  "W-1045": [
    L("labor", "Leak-down test and locate leaks", 800, 15_500, "done", { concern: 0, by: "standing", diagnosis: true }),
    L("part", "Glad-hand seal, trailer supply", 2000, 495, "approved", { concern: 0, by: "office" }),
    L("part", "Air line, 3/8 in nylon (ft)", 12_000, 185, "approved", { concern: 0, by: "office" }),
    L("labor", "Replace service line at rear axle, retest", 1600, 14_250, "in_progress", { concern: 0, by: "office" }),
  ],
  "W-1046": [
    L("labor", "Remove tilt cylinder, disassemble, inspect", 3200, 14_250, "done", { concern: 0, by: "supervisor" }),
    L("sublet", "Re-chrome tilt cylinder rod (machine shop)", 1000, 68_000, "approved", { concern: 0, by: "supervisor" }),
    L("part", "Tilt cylinder seal kit", 1000, 21_475, "approved", { concern: 0, by: "supervisor" }),
  ],
  "W-1048": [
    L("labor", "Trace ABS fault, repair sensor lead", 1400, 14_250, "done", { concern: 0, by: "office" }),
    L("part", "Weatherproof splice kit", 1000, 2_350, "done", { concern: 0, by: "office" }),
  ],
  "W-1049": [
    L("labor", "Diagnose liftgate, repair ground", 1300, 14_250, "done", { concern: 0, by: "supervisor" }),
    L("part", "Ground strap, 4 gauge", 1000, 2_875, "done", { concern: 0, by: "supervisor" }),
  ],
  "W-1050": [
    L("labor", "Pressure-wash radiator and charge-air cooler cores", 2500, 14_250, "proposed", { concern: 0 }),
    L("part", "Fan belt", 1000, 8_460, "proposed", { concern: 0, partNumber: "FB-8PK-1830" }),
    L("part", "Coolant, 50/50 premix (gal)", 6000, 1_240, "proposed", { concern: 0 }),
  ],
};

/** Deferred work from earlier visits: comes back to be offered on the open work order. */
const DEFERRED: { wo: string; lines: LineSeed[] }[] = [
  {
    wo: "W-1001",
    lines: [
      L("part", "Plow cutting edge, carbide insert (plan for spring)", 1000, 74_500, "held", { by: "supervisor", note: "Next budget year." }),
      L("labor", "Sandblast and repaint dump body", 9000, 14_250, "declined", { by: "supervisor", note: "Not this year." }),
    ],
  },
];

export async function seedEstimates(ctx: SeedContext): Promise<void> {
  for (const [woKey, lines] of Object.entries(ESTIMATES)) await insertLines(ctx, woKey, lines);
  for (const d of DEFERRED) await insertLines(ctx, d.wo, d.lines);
  await tightenSchoolBudget(ctx);

  // Diagnosis on T-9: 1 h 42 min of the 2.0 h approved used, so the 80 % warning shows. Clocked after the approval.
  const [diag] = await ctx.db.select({ id: estimateLines.id, approvedAt: estimateLines.approvedAt }).from(estimateLines).where(eqWo(ctx, "W-1043"));
  const tech = id(ctx, "user:tech@quarry-road.example");
  const start = Math.max(Date.parse(diag!.approvedAt!) + 30 * 60_000, Date.parse(milestones(ctx, "W-1043").diagnosing!) + 10 * 60_000);
  await ctx.db.insert(timeEntries).values([
    { lineId: diag!.id, workOrderId: id(ctx, "wo:W-1043"), techId: tech, startedAt: new Date(start).toISOString(), endedAt: new Date(start + 60 * 60_000).toISOString() },
    { lineId: diag!.id, workOrderId: id(ctx, "wo:W-1043"), techId: tech, startedAt: new Date(start + 3 * 3_600_000).toISOString(), endedAt: new Date(start + 3 * 3_600_000 + 42 * 60_000).toISOString() },
  ]);
}

function eqWo(ctx: SeedContext, woKey: string) {
  return eqSql(estimateLines.workOrderId, id(ctx, `wo:${woKey}`));
}

const MIN = 60_000;

/**
 * When a line was written and decided, in the visit's own order: diagnosis the standing
 * authorisation covers is written and started 40–45 min after check-in (before Diagnosing);
 * other lines are written just before the estimate goes out; the customer decides after it went
 * out and before the next status.
 */
function lineTimes(ctx: SeedContext, woKey: string, l: LineSeed): { createdAt: string; decidedAt: string | null } {
  const m = milestones(ctx, woKey);
  const at = (ms: number) => new Date(Math.min(ms, ctx.now.getTime() - 10 * MIN)).toISOString();
  const checkedIn = Date.parse(m.checked_in!);
  if (l.by === "standing") return { createdAt: at(checkedIn + 40 * MIN), decidedAt: at(checkedIn + 45 * MIN) };
  const sent = m.waiting_approval ? Date.parse(m.waiting_approval) : null;
  const written = sent === null ? Math.max(checkedIn + 50 * MIN, ctx.now.getTime() - 3 * 60 * MIN) : Math.max(checkedIn + 20 * MIN, sent - 20 * MIN);
  if (!l.by) return { createdAt: at(written), decidedAt: null };
  if (sent === null) throw new Error(`seed: ${woKey} has decided lines but was never sent`);
  const next = nextMilestone(ctx, woKey, m.waiting_approval!);
  const until = next ? Date.parse(next) : ctx.now.getTime() - 20 * MIN;
  // In the customer's working day, and never before the estimate reached them.
  const decided = laterInShopHours(sent + (until - sent) * 0.3);
  return { createdAt: at(written), decidedAt: at(Math.min(decided, until - MIN)) };
}

async function insertLines(ctx: SeedContext, woKey: string, lines: LineSeed[]): Promise<void> {
  const woId = id(ctx, `wo:${woKey}`);
  const [wo] = await ctx.db.select({ accountId: workOrders.accountId }).from(workOrders).where(eqSql(workOrders.id, woId));
  for (const [position, l] of lines.entries()) {
    const amount = lineAmountCents(l.qty, l.price);
    const decided = l.by !== undefined;
    const approved = decided && ["approved", "in_progress", "done"].includes(l.state);
    const { createdAt, decidedAt } = lineTimes(ctx, woKey, l);
    const at = decidedAt ?? createdAt;
    const approverId = l.by && l.by !== "standing" ? id(ctx, `user:${APPROVER_EMAIL[l.by]}`) : null;
    const [row] = await ctx.db
      .insert(estimateLines)
      .values({
        workOrderId: woId,
        concernId: l.concern === undefined ? null : (ctx.ids.get(`concern:${woKey}:${l.concern}`) ?? null),
        position,
        kind: l.kind,
        description: l.description,
        partNumber: l.partNumber ?? "",
        quantityMilli: l.qty,
        unitPriceCents: l.price,
        taxable: l.taxable ?? false,
        coreChargeCents: l.core ?? 0,
        isDiagnosis: l.diagnosis ?? false,
        state: l.state,
        version: decided ? 3 : 2,
        approvedByUserId: approved ? approverId : null,
        byStanding: approved && l.by === "standing",
        approvedAmountCents: approved ? amount : null,
        approvedAt: approved ? at : null,
        createdBy: id(ctx, "user:writer@quarry-road.example"),
        createdAt,
        updatedAt: at,
      })
      .returning({ id: estimateLines.id });
    if (decided) {
      const decision: Decision = approved ? "approve" : l.state === "declined" ? "decline" : "hold";
      await ctx.db.insert(decisions).values({
        lineId: row!.id,
        workOrderId: woId,
        accountId: wo!.accountId,
        decision,
        byUserId: approverId,
        byStanding: l.by === "standing",
        amountCents: amount,
        lineVersion: 2,
        note: l.note ?? "",
        at,
      });
    }
  }
}

/**
 * The school district is close to its repair budget: a round budget with
 * $1,100–$1,600 left this fiscal year (July–June), so the pending brake lines
 * on Bus 22 ($2,257.95 together) show the budget refusal on first start.
 */
async function tightenSchoolBudget(ctx: SeedContext): Promise<void> {
  const accountId = id(ctx, "account:schools");
  // The same count the decision path uses, so the refusal really shows.
  const used = await recountBudgetUsed(ctx.db, accountId, currentFiscalYear({ fiscalYearStartMonth: 7 }, ctx.now));
  const budget = Math.ceil((used + 110_000) / 50_000) * 50_000;
  await ctx.db.update(accounts).set({ repairBudgetCents: budget }).where(eqSql(accounts.id, accountId));
}
