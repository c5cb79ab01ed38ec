import { eq } from "drizzle-orm";
import { decisions, estimateLines, workOrders } from "@/db/schema";
import type { LineKind } from "@/lib/domain";
import { lineAmountCents } from "@/lib/money";
import { type SeedContext, id, laterInShopHours, milestones } from "./context";

interface LineSeed {
  kind: LineKind;
  description: string;
  partNumber?: string;
  quantityMilli: number;
  unitPriceCents: number;
  coreChargeCents?: number;
}

const SHOP_RATE = 14_250;

// Invented parts, numbers and prices for the demo; labour at the shop rate.
export const WORK_TEMPLATES: Record<string, LineSeed[]> = {
  "Preventive maintenance service": [
    { kind: "labor", description: "Preventive maintenance: engine oil and filters, chassis lube, brake, steering, light and tyre checks", quantityMilli: 3_500, unitPriceCents: SHOP_RATE },
    { kind: "part", description: "Engine oil 15W-40, bulk (gal)", quantityMilli: 10_500, unitPriceCents: 1_475 },
    { kind: "part", description: "Oil filter, spin-on", partNumber: "OF-2210", quantityMilli: 1_000, unitPriceCents: 3_840 },
    { kind: "part", description: "Fuel filter set, primary and secondary", partNumber: "FF-1420K", quantityMilli: 1_000, unitPriceCents: 6_190 },
    { kind: "part", description: "Air filter element, radial seal", partNumber: "AF-3390", quantityMilli: 1_000, unitPriceCents: 8_610 },
    { kind: "fee", description: "Waste oil and filter disposal", quantityMilli: 1_000, unitPriceCents: 1_200 },
  ],
  "Annual inspection": [
    { kind: "labor", description: "Annual inspection (49 CFR 396.17) with written report", quantityMilli: 2_000, unitPriceCents: SHOP_RATE },
    { kind: "labor", description: "Replace two marker lamps and a cracked stop/tail lens", quantityMilli: 400, unitPriceCents: SHOP_RATE },
    { kind: "part", description: "LED marker lamp, amber, 2 in round", partNumber: "ML-2A", quantityMilli: 2_000, unitPriceCents: 1_860 },
    { kind: "part", description: "Stop/tail lens, red", partNumber: "LN-44R", quantityMilli: 1_000, unitPriceCents: 2_475 },
    { kind: "fee", description: "Inspection decal and report", quantityMilli: 1_000, unitPriceCents: 1_000 },
  ],
  "Brake adjustment and chamber replacement": [
    { kind: "labor", description: "Replace spring brake chambers and slack adjusters, drive axle, both sides", quantityMilli: 3_200, unitPriceCents: SHOP_RATE },
    { kind: "part", description: "Spring brake chamber, type 30/30 long stroke", partNumber: "BC-3030L", quantityMilli: 2_000, unitPriceCents: 9_650, coreChargeCents: 1_500 },
    { kind: "part", description: "Automatic slack adjuster, 5.5 in arm", partNumber: "SA-55", quantityMilli: 2_000, unitPriceCents: 7_425, coreChargeCents: 1_000 },
    { kind: "labor", description: "Measure and record pushrod stroke at every wheel end; road test", quantityMilli: 600, unitPriceCents: SHOP_RATE },
  ],
  // A big mid-year job: most of the school district's repair budget this fiscal year.
  "Transmission replacement and rear axle reseal": [
    { kind: "labor", description: "Remove and replace automatic transmission; flush cooler lines", quantityMilli: 18_000, unitPriceCents: SHOP_RATE },
    { kind: "part", description: "Remanufactured automatic transmission, 5-speed", partNumber: "AT-5R-RM", quantityMilli: 1_000, unitPriceCents: 980_000, coreChargeCents: 150_000 },
    { kind: "part", description: "Transmission fluid, synthetic (gal)", quantityMilli: 12_000, unitPriceCents: 3_890 },
    { kind: "part", description: "Transmission cooler, heavy duty", partNumber: "TC-880", quantityMilli: 1_000, unitPriceCents: 112_450 },
    { kind: "labor", description: "Reseal rear axle: hub seals both sides, pinion seal", quantityMilli: 6_500, unitPriceCents: SHOP_RATE },
    { kind: "part", description: "Wheel seal kit, drive axle", partNumber: "WS-22D", quantityMilli: 2_000, unitPriceCents: 8_740 },
    { kind: "part", description: "Pinion seal", partNumber: "PS-180", quantityMilli: 1_000, unitPriceCents: 4_690 },
    { kind: "sublet", description: "Driveshaft balance and U-joints (driveline shop)", quantityMilli: 1_000, unitPriceCents: 64_500 },
  ],
  "Hydraulic hose replacement": [
    { kind: "labor", description: "Replace leaking hydraulic hoses and bleed the circuit", quantityMilli: 1_800, unitPriceCents: SHOP_RATE },
    { kind: "part", description: "Hydraulic hose assembly, 1/2 in × 48 in, crimped ends", partNumber: "HH-0848", quantityMilli: 2_000, unitPriceCents: 6_480 },
    { kind: "part", description: "Hydraulic oil AW46 (gal)", quantityMilli: 5_000, unitPriceCents: 1_240 },
    { kind: "sublet", description: "Odd-size hose made up at the hydraulic supplier", quantityMilli: 1_000, unitPriceCents: 4_500 },
  ],
};

const APPROVERS: Record<string, string> = {
  township: "user:supervisor@brennan-twp.example",
  schools: "user:transport@alder-falls-schools.example",
  quarry: "user:office@kettle-ridge.example",
};

/**
 * Gives a released visit its approved and finished lines (state done), each
 * with the approver's decision, as the estimate and repair would have left them.
 * `extraLabourMilli` varies the first labour line so visits differ.
 */
export async function seedDoneLines(ctx: SeedContext, woKey: string, account: string, extraLabourMilli: number): Promise<void> {
  const woId = id(ctx, `wo:${woKey}`);
  const [wo] = await ctx.db.select().from(workOrders).where(eq(workOrders.id, woId)).limit(1);
  if (!wo) throw new Error(`seed: no work order ${woKey}`);
  const template = WORK_TEMPLATES[wo.title];
  if (!template) throw new Error(`seed: no line template for "${wo.title}"`);
  const approver = id(ctx, APPROVERS[account] ?? "");
  const writer = id(ctx, "user:writer@quarry-road.example");
  // Written before the estimate went out, approved two hours after it went out.
  const sent = milestones(ctx, woKey).waiting_approval;
  if (!sent) throw new Error(`seed: ${woKey} was never sent for approval`);
  const approvedAt = new Date(laterInShopHours(Date.parse(sent) + 2 * 3_600_000)).toISOString();
  const doneAt = wo.releasedAt ?? approvedAt;
  const rows = template.map((l, i) => {
    const quantityMilli = i === 0 ? l.quantityMilli + extraLabourMilli : l.quantityMilli;
    return {
      workOrderId: wo.id,
      concernId: ctx.ids.get(`concern:${woKey}:0`) ?? null,
      position: i,
      kind: l.kind,
      description: l.description,
      partNumber: l.partNumber ?? "",
      quantityMilli,
      unitPriceCents: l.unitPriceCents,
      // The shop taxes parts only (shop settings: taxParts).
      taxable: l.kind === "part",
      coreChargeCents: l.coreChargeCents ?? 0,
      laborRateId: l.kind === "labor" ? id(ctx, "rate:Shop labour") : null,
      state: "done" as const,
      approvedByUserId: approver,
      approvedAmountCents: lineAmountCents(quantityMilli, l.unitPriceCents),
      approvedAt,
      createdBy: writer,
      createdAt: new Date(Date.parse(sent) - 20 * 60_000).toISOString(),
      updatedAt: doneAt,
    };
  });
  const inserted = await ctx.db.insert(estimateLines).values(rows).returning({ id: estimateLines.id, amount: estimateLines.approvedAmountCents });
  await ctx.db.insert(decisions).values(
    inserted.map((l) => ({
      lineId: l.id,
      workOrderId: wo.id,
      accountId: wo.accountId,
      decision: "approve" as const,
      byUserId: approver,
      amountCents: l.amount ?? 0,
      lineVersion: 1,
      at: approvedAt,
    })),
  );
}
