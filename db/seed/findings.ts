import { findingReadings, findings, photos, workOrders } from "@/db/schema";
import { eq } from "drizzle-orm";
import type { Severity } from "@/lib/domain";
import { checkReading, type ReadingInput } from "@/lib/specs";
import { type SeedContext, id, inShopHours, milestones, nextMilestone } from "./context";
import type { DemoDrawing } from "./demo-drawings";
import type { DemoPhotos } from "./demo-photos";

interface FindingSeed {
  wo: string;
  concern?: number;
  tech: "tech" | "tech2";
  title: string;
  severity: Severity;
  note: string;
  photos: DemoDrawing[];
  readings?: { location: string; input: ReadingInput }[];
}

// Readings on both sides of their limits; the verdicts are worked out by lib/specs, as for a technician's post.
const FINDINGS: FindingSeed[] = [
  {
    wo: "W-1044", concern: 0, tech: "tech2", severity: "out_of_service",
    title: "Right rear brake stroke beyond the readjustment limit",
    note: "Slack adjuster on the right rear is **not adjusting**: it wound back out after a manual adjustment.\n\n- Left rear is within the limit\n- Right rear is ¼ in past it\n\nThe bus should not carry students until this is fixed.",
    photos: ["brakeChamberLong"],
    readings: [
      { location: "Rear axle, right", input: { kind: "brake_stroke", chamberType: 30, strokeClass: "standard", value: 2.25 } },
      { location: "Rear axle, left", input: { kind: "brake_stroke", chamberType: 30, strokeClass: "standard", value: 1.875 } },
    ],
  },
  {
    wo: "W-1042", concern: 1, tech: "tech", severity: "fix_now",
    title: "Drag link and both tie-rod ends worn",
    note: "Play felt by hand at both tie-rod ends and the drag link's lower end. The left boot is **torn** and the grease is gone.",
    photos: ["tieRodEnd"],
  },
  {
    wo: "W-1042", concern: 0, tech: "tech", severity: "fix_now",
    title: "Plow lift cylinder rod scored; seals bypassing",
    note: "Plow drops about 3 in an hour with the valve in hold. Rod is scored over about 8 in of its travel: reseal alone will not last.",
    photos: ["liftCylinder"],
  },
  {
    wo: "W-1042", concern: 2, tech: "tech", severity: "plan",
    title: "Front brake chambers at the stroke limit; steer tyres fine",
    note: "Left front stroke is right at the limit, right front just under. Adjusted both; plan chambers and adjusters at the next service.",
    photos: ["brakeChamberOk", "tread"],
    readings: [
      { location: "Front axle, left", input: { kind: "brake_stroke", chamberType: 24, strokeClass: "standard", value: 1.75 } },
      { location: "Front axle, right", input: { kind: "brake_stroke", chamberType: 24, strokeClass: "standard", value: 1.625 } },
      { location: "Steer, left", input: { kind: "tread_depth", position: "steer", value: 5, unit: "32nds" } },
      { location: "Drive, outer right", input: { kind: "tread_depth", position: "other", value: 3, unit: "32nds" } },
    ],
  },
  {
    wo: "W-1043", concern: 0, tech: "tech", severity: "fix_now",
    title: "Key-off drain above this truck's figure",
    note: "Batteries are healthy when warm. After an hour asleep the truck still draws **180 mA**; this unit's accepted figure is 120 mA. Pulling fuses one at a time next.",
    photos: ["batteries", "drainMeter"],
    readings: [
      { location: "Both batteries", input: { kind: "battery_ocv", value: 12.52, temperature: 68, temperatureUnit: "F" } },
      { location: "Front battery", input: { kind: "battery_load_test", value: 9.9, temperature: 70, temperatureUnit: "F" } },
      { location: "Main negative cable", input: { kind: "key_off_drain", value: 180, unitLimitMa: 120, minutesAfterKeyOff: 60 } },
    ],
  },
  {
    wo: "W-1045", concern: 0, tech: "tech", severity: "fix_now",
    title: "Air system leaks down: cracked service line",
    note: "Soapy water shows a crack in the service line at the rear axle, and the trailer supply glad-hand seal is split.",
    photos: ["airLine"],
    readings: [
      { location: "Brakes released, engine off", input: { kind: "air_leak", brakes: "released", vehicle: "single", value: 5 } },
      { location: "Dash gauge", input: { kind: "governor_cut_out", value: 124 } },
    ],
  },
  {
    wo: "W-1050", concern: 0, tech: "tech", severity: "fix_now",
    title: "Radiator core packed with fines",
    note: "Core face is packed with crusher fines across most of its height. Fan belt glazed.",
    photos: ["radiator"],
  },
];

/**
 * Findings are posted while the unit is diagnosed: spread between the move to Diagnosing and the
 * next status (or a little before now, if it is still being diagnosed), in the order listed.
 */
function findingTime(ctx: SeedContext, f: FindingSeed): string {
  const diagnosing = milestones(ctx, f.wo).diagnosing;
  if (!diagnosing) throw new Error(`seed: ${f.wo} has findings but was never diagnosed`);
  const start = Date.parse(diagnosing);
  const end = Date.parse(nextMilestone(ctx, f.wo, diagnosing) ?? new Date(ctx.now.getTime() - 30 * 60_000).toISOString());
  // A finding every 40 minutes or so from the start of diagnosis, in the shop's working day.
  const same = FINDINGS.filter((x) => x.wo === f.wo);
  const k = same.indexOf(f) + 1;
  const step = Math.min(40 * 60_000, (end - start) / (same.length + 1));
  return new Date(inShopHours(start + step * k)).toISOString();
}

/** Findings on the open demo visits, with drawn photos and checked readings. */
export async function seedFindings(ctx: SeedContext, demoPhotos: DemoPhotos | null): Promise<void> {
  for (const f of FINDINGS) {
    const woId = id(ctx, `wo:${f.wo}`);
    const [wo] = await ctx.db
      .select({ accountId: workOrders.accountId, unitId: workOrders.unitId })
      .from(workOrders)
      .where(eq(workOrders.id, woId))
      .limit(1);
    if (!wo) throw new Error(`seed: no work order ${f.wo}`);
    const techId = id(ctx, `user:${f.tech}@quarry-road.example`);
    const at = findingTime(ctx, f);
    const [row] = await ctx.db
      .insert(findings)
      .values({
        workOrderId: woId,
        concernId: f.concern === undefined ? null : id(ctx, `concern:${f.wo}:${f.concern}`),
        title: f.title,
        severity: f.severity,
        noteMarkdown: f.note,
        createdBy: techId,
        createdAt: at,
        updatedAt: at,
      })
      .returning({ id: findings.id });
    const findingId = row!.id;
    ctx.ids.set(`finding:${f.wo}:${f.title}`, findingId);

    if (f.readings?.length) {
      await ctx.db.insert(findingReadings).values(
        f.readings.map(({ location, input }, position) => {
          const r = checkReading(input);
          return {
            findingId, position, kind: r.kind, location, input, value: r.value, unit: r.unit, verdict: r.verdict,
            limitText: r.limit, limitValue: r.limitValue, source: r.source, sourceKind: r.sourceKind, note: r.note ?? "", createdAt: at,
          };
        }),
      );
    }
    for (const drawing of f.photos) {
      const stored = demoPhotos?.get(drawing);
      if (!stored) continue;
      await ctx.db.insert(photos).values({
        ...stored, accountId: wo.accountId, unitId: wo.unitId, workOrderId: woId, findingId, mime: "image/jpeg", uploadedBy: techId, createdAt: at,
      });
    }
  }
}
