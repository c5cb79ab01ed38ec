import { eq } from "drizzle-orm";
import { concerns, counters, statusEvents, workOrders } from "@/db/schema";
import { WORK_ORDER_STATUSES, type WorkOrderStatus } from "@/lib/domain";
import { type SeedContext, daysAgo, id, inShopHours } from "./context";
import { UNIT_SEEDS } from "./units";
import { isColdSeason } from "./weather";

interface ConcernSeed {
  complaint: string;
  cause?: string;
  correction?: string;
  intermittent?: boolean;
  recordHint?: string;
}

interface WorkOrderSeed {
  key: string;
  number: number;
  unit: string;
  status: WorkOrderStatus;
  title: string;
  tech?: "tech" | "tech2";
  openedDaysAgo: number;
  promisedInDays?: number;
  poNumber?: string;
  concerns: ConcernSeed[];
  notes?: Partial<Record<WorkOrderStatus, string>>;
  /** The statuses it went through, when not simply every one up to its status in order. */
  steps?: WorkOrderStatus[];
}

export const OPEN_WORK_ORDERS: WorkOrderSeed[] = [
  {
    key: "W-1042", number: 1042, unit: "T-14", status: "waiting_approval", tech: "tech", openedDaysAgo: 3, promisedInDays: 4,
    title: "Plow hydraulics, steering and brakes", poNumber: "BT-2026-0412",
    concerns: [
      { complaint: "Plow drifts down overnight with the valve in hold.", cause: "Lift cylinder piston seals bypassing; scoring on the rod.", correction: "" },
      { complaint: "Truck wanders at highway speed.", cause: "Drag link and both tie-rod ends worn past limits.", correction: "" },
      { complaint: "Annual inspection due next month.", cause: "", correction: "" },
    ],
    notes: { diagnosing: "On the lift. Starting with the plow circuit.", waiting_approval: "Estimate sent: steering joints, lift cylinder reseal, front brake chambers." },
  },
  {
    key: "W-1043", number: 1043, unit: "T-9", status: "diagnosing", tech: "tech", openedDaysAgo: 2, promisedInDays: 3,
    // The diagnosis hours were approved before the tech started: checked in, sent, then diagnosing.
    steps: ["checked_in", "waiting_approval", "diagnosing"],
    title: "",
    concerns: [
      {
        complaint: "",
        intermittent: true,
        recordHint: "Note how long it sat and the outside temperature; if you can, read battery voltage before cranking.",
      },
    ],
    notes: {
      waiting_approval: "Asked for 2.0 h of diagnosis: battery, cranking and key-off drain tests.",
      diagnosing: "Batteries load-tested fine warm. Setting up a key-off drain test overnight.",
    },
  },
  {
    key: "W-1044", number: 1044, unit: "BUS-22", status: "waiting_approval", tech: "tech2", openedDaysAgo: 1, promisedInDays: 1,
    title: "Brake check failed at pre-trip",
    concerns: [{ complaint: "Driver reports long pedal and the pre-trip brake check failed.", cause: "Right rear pushrod stroke beyond limit; slack adjuster not adjusting.", correction: "" }],
    notes: { diagnosing: "Measured strokes on all four wheel ends.", waiting_approval: "Bus is out of service until the right rear is fixed. Estimate sent." },
  },
  {
    key: "W-1045", number: 1045, unit: "H-7", status: "repairing", tech: "tech", openedDaysAgo: 4, promisedInDays: 1,
    title: "Air system leaks down overnight",
    concerns: [{ complaint: "Air gauges at zero every morning.", cause: "Leaking trailer supply glad-hand seal and a cracked service line at the rear axle.", correction: "Replacing seal and line; retest leak-down." }],
    notes: { diagnosing: "Leak-down 5 psi/min brakes released.", repairing: "Parts in. Replacing the service line now." },
  },
  {
    key: "W-1046", number: 1046, unit: "L-3", status: "waiting_parts", tech: "tech2", openedDaysAgo: 6, promisedInDays: 5,
    title: "Bucket tilt cylinder leaking",
    concerns: [{ complaint: "Oil running down the tilt cylinder; bucket rolls back slowly.", cause: "Rod seal failed; rod chrome pitted.", correction: "Rod to be re-chromed by the machine shop; seal kit on order." }],
    notes: { waiting_parts: "Rod at the machine shop, back Thursday." },
  },
  {
    key: "W-1047", number: 1047, unit: "BUS-9", status: "checked_in", openedDaysAgo: 0, promisedInDays: 2,
    title: "Heater blower weak; exhaust smell at the rear",
    concerns: [
      { complaint: "Front heater blower weak on high." },
      { complaint: "Driver smells exhaust at the rear seats." },
    ],
  },
  {
    key: "W-1048", number: 1048, unit: "H-5", status: "final_check", tech: "tech2", openedDaysAgo: 5, promisedInDays: 0,
    title: "Trailer ABS lamp on",
    concerns: [{ complaint: "Trailer ABS lamp stays on after start-up.", cause: "Chafed sensor lead at the right rear.", correction: "Repaired lead, cleared codes, road-tested." }],
    notes: { final_check: "Road test done; lamp out. Final walk-around." },
  },
  {
    key: "W-1049", number: 1049, unit: "T-21", status: "ready", tech: "tech2", openedDaysAgo: 2, promisedInDays: 0,
    title: "Liftgate inoperative", poNumber: "BT-2026-0415",
    concerns: [{ complaint: "Liftgate will not raise.", cause: "Corroded ground at the pump motor.", correction: "Cleaned and sealed ground; added a second ground strap." }],
    notes: { ready: "Ready for pickup. Keys at the front counter." },
  },
  {
    key: "W-1050", number: 1050, unit: "LD-2", status: "waiting_approval", tech: "tech", openedDaysAgo: 2, promisedInDays: 3,
    title: "Engine overheating under load",
    concerns: [{ complaint: "Temperature climbs into the red when loading trucks.", cause: "Radiator core plugged with fines; fan belt glazed.", correction: "" }],
    notes: { waiting_approval: "Estimate sent: radiator clean-out and belt." },
  },
];

const HISTORY_TITLES = [
  "Preventive maintenance service",
  "Annual inspection",
  "Brake adjustment and chamber replacement",
  "Hydraulic hose replacement",
];

const HOUR = 3_600_000;

/**
 * The statuses a visit went through and when. Checked in at 8 a.m. shop time (13:00 UTC), on to
 * the next status an hour later, the rest spread evenly towards an hour ago (open visits) or to
 * its release three days later at 10 a.m. (past visits, invoiced that afternoon).
 */
function timeline(seed: Pick<WorkOrderSeed, "status" | "openedDaysAgo" | "notes" | "steps">, ctx: SeedContext) {
  const steps = seed.steps ?? WORK_ORDER_STATUSES.slice(0, WORK_ORDER_STATUSES.indexOf(seed.status) + 1);
  const now = ctx.now.getTime();
  const released = seed.status === "released";
  const opened = released ? Date.parse(daysAgo(ctx, seed.openedDaysAgo, 13)) : Math.min(Date.parse(daysAgo(ctx, seed.openedDaysAgo, 13)), now - 3 * HOUR);
  const end = released ? Date.parse(daysAgo(ctx, seed.openedDaysAgo - 3, 15)) : now - HOUR;
  const second = Math.min(opened + HOUR, end);
  // Past visits end at their release; an open visit has been in its last status a while, not a minute.
  const spans = released ? Math.max(steps.length - 2, 1) : Math.max(steps.length - 1, 1);
  const times = steps.map((_, i) => (i === 0 ? opened : i === 1 ? second : Math.min(inShopHours(second + ((end - second) * (i - 1)) / spans), end)));
  return steps.map((status, i) => ({
    status,
    note: seed.notes?.[status] ?? (i === 0 ? "Unit checked in." : ""),
    at: new Date(times[i]!).toISOString(),
  }));
}

/** T-9's complaint as the fleet would put it in this season (the seed is laid out relative to now). */
function seasonal(wo: WorkOrderSeed, ctx: SeedContext): WorkOrderSeed {
  if (wo.key !== "W-1043") return wo;
  const cold = isColdSeason(ctx.now);
  return {
    ...wo,
    title: cold ? "No-start after cold nights" : "No-start after sitting overnight",
    concerns: wo.concerns.map((c) => ({
      ...c,
      complaint: cold
        ? "Cranks slowly and will not start after sitting overnight in the cold; fine once jumped."
        : "Cranks slowly, or will not start, after sitting overnight or over a weekend; fine once jumped.",
    })),
  };
}

export async function seedWorkOrders(ctx: SeedContext): Promise<void> {
  const techs = { tech: id(ctx, "user:tech@quarry-road.example"), tech2: id(ctx, "user:tech2@quarry-road.example") };
  const writer = id(ctx, "user:writer@quarry-road.example");

  // A year of released visits first (W-1001 …), so every unit has history.
  let number = 1000;
  for (const [i, u] of UNIT_SEEDS.entries()) {
    for (const visit of [0, 1]) {
      if (visit === 1 && i % 3 === 2) continue;
      number += 1;
      const openedDaysAgo = 40 + ((i * 53 + visit * 97) % 300);
      const woId = await insertWorkOrder(ctx, {
        key: `W-${number}`, number, unit: u.key, status: "released", tech: i % 2 ? "tech2" : "tech",
        openedDaysAgo, title: HISTORY_TITLES[(i + visit) % HISTORY_TITLES.length]!,
        concerns: [{ complaint: "Scheduled service.", cause: "Due by hours.", correction: "Serviced per the unit's schedule." }],
      }, techs, writer);
      ctx.ids.set(`wo:W-${number}`, woId);
    }
  }
  // The school district's big job of this fiscal year (Bus 31), about three months ago.
  number += 1;
  ctx.ids.set(
    `wo:W-${number}`,
    await insertWorkOrder(ctx, {
      key: `W-${number}`, number, unit: "BUS-31", status: "released", tech: "tech", openedDaysAgo: 100,
      title: "Transmission replacement and rear axle reseal",
      concerns: [{ complaint: "Transmission slipping between 2nd and 3rd; oil on the rear axle hubs.", cause: "Clutch pack failure; hub seals leaking.", correction: "Replaced transmission with a remanufactured unit; resealed the rear axle." }],
    }, techs, writer),
  );
  if (number >= 1042) throw new Error("seed: history numbers ran into the open work orders");

  for (const wo of OPEN_WORK_ORDERS) {
    ctx.ids.set(`wo:${wo.key}`, await insertWorkOrder(ctx, seasonal(wo, ctx), techs, writer));
  }
  const maxNumber = Math.max(...OPEN_WORK_ORDERS.map((w) => w.number));
  await ctx.db.update(counters).set({ value: maxNumber }).where(eq(counters.name, "work_order"));
}

async function insertWorkOrder(
  ctx: SeedContext,
  wo: WorkOrderSeed,
  techs: Record<"tech" | "tech2", string>,
  writer: string,
): Promise<string> {
  const unit = UNIT_SEEDS.find((u) => u.key === wo.unit)!;
  const events = timeline(wo, ctx);
  const marks: Partial<Record<WorkOrderStatus, string>> = {};
  for (const e of events) marks[e.status] ??= e.at;
  ctx.milestones.set(wo.key, marks);
  const openedAt = events[0]!.at;
  const lastAt = events.at(-1)!.at;
  const released = wo.status === "released";
  const [row] = await ctx.db
    .insert(workOrders)
    .values({
      number: wo.number,
      unitId: id(ctx, `unit:${unit.key}`),
      accountId: id(ctx, `account:${unit.account}`),
      status: wo.status,
      title: wo.title,
      assignedTechId: wo.tech ? techs[wo.tech] : null,
      promisedAt: wo.promisedInDays === undefined ? null : daysAgo(ctx, -wo.promisedInDays, 22),
      // The fleet's PO numbers carry this year, whatever year the demo is loaded in.
      poNumber: wo.poNumber?.replace(/-20\d\d-/, `-${ctx.now.getUTCFullYear()}-`) ?? null,
      openedAt,
      sentForApprovalAt: events.find((e) => e.status === "waiting_approval")?.at ?? null,
      releasedAt: released ? lastAt : null,
      createdBy: writer,
      createdAt: openedAt,
      updatedAt: lastAt,
    })
    .returning({ id: workOrders.id });
  const woId = row!.id;
  await ctx.db.insert(statusEvents).values(
    events.map((e) => ({ workOrderId: woId, status: e.status, note: e.note, byUserId: wo.tech ? techs[wo.tech] : writer, at: e.at })),
  );
  const concernRows = await ctx.db
    .insert(concerns)
    .values(
      wo.concerns.map((c, i) => ({
        unitId: id(ctx, `unit:${unit.key}`),
        workOrderId: woId,
        position: i,
        complaint: c.complaint,
        cause: c.cause ?? "",
        correction: c.correction ?? "",
        intermittent: c.intermittent ?? false,
        recordHint: c.recordHint ?? "",
        createdBy: writer,
        // An intermittent concern stays open on the unit across visits; T-9's log goes back a season.
        createdAt: c.intermittent ? daysAgo(ctx, wo.openedDaysAgo + 100, 14) : openedAt,
      })),
    )
    .returning({ id: concerns.id });
  concernRows.forEach((c, i) => ctx.ids.set(`concern:${wo.key}:${i}`, c.id));
  return woId;
}
