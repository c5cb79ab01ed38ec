import { and, desc, eq } from "drizzle-orm";
import { concerns, occurrences, workOrders } from "@/db/schema";
import { celsiusFromFahrenheit } from "@/lib/occurrences/temperature";
import type { Symptom } from "@/lib/occurrences/symptoms";
import { type SeedContext, daysAgo, id } from "./context";
import { usualAfternoonHighF, usualMorningLowF } from "./weather";

export interface OccurrenceSeed {
  daysAgo: number;
  /** Hour UTC: 12–13 is 6–7 a.m. in the shop's time zone, when trucks are started. */
  hour: number;
  hoursParked: number | null;
  tempF: number | null;
  volts: number | null;
  symptom: Symptom;
  symptomText?: string;
  recovered: boolean | null;
  note: string;
  by: string;
}

const FOREMAN = "foreman@brennan-twp.example";
const SUPERVISOR = "supervisor@brennan-twp.example";
const CLERK = "clerk@brennan-twp.example";
const DAY = 86_400_000;

/** A morning: days ago; hours parked; how far the morning was from the usual low (°F); a weekend soak lands on a Monday. */
type Morning = { daysAgo: number; parked: number; off: number; voltsRead: boolean; by: string; weekend?: boolean };

const T9_MORNINGS: Morning[] = [
  { daysAgo: 98, parked: 14, off: 3, voltsRead: false, by: FOREMAN },
  { daysAgo: 91, parked: 13.5, off: -2, voltsRead: false, by: FOREMAN },
  { daysAgo: 84, parked: 62, off: 8, voltsRead: true, by: SUPERVISOR, weekend: true },
  { daysAgo: 77, parked: 15, off: -6, voltsRead: true, by: FOREMAN },
  { daysAgo: 70, parked: 11, off: -3, voltsRead: false, by: FOREMAN },
  { daysAgo: 63, parked: 8, off: 1, voltsRead: true, by: FOREMAN },
  { daysAgo: 56, parked: 16, off: -9, voltsRead: true, by: FOREMAN },
  { daysAgo: 49, parked: 11.5, off: 0, voltsRead: false, by: CLERK },
  { daysAgo: 42, parked: 64, off: -4, voltsRead: true, by: SUPERVISOR, weekend: true },
  { daysAgo: 35, parked: 13, off: 4, voltsRead: true, by: FOREMAN },
  { daysAgo: 28, parked: 14, off: -7, voltsRead: true, by: FOREMAN },
  { daysAgo: 21, parked: 11.5, off: -1, voltsRead: false, by: FOREMAN },
  { daysAgo: 14, parked: 38, off: -3, voltsRead: true, by: FOREMAN, weekend: true },
  { daysAgo: 7, parked: 15, off: 2, voltsRead: true, by: SUPERVISOR },
  { daysAgo: 4, parked: 14, off: -8, voltsRead: true, by: FOREMAN },
];

const NO_START_NOTES = ["Jumped it from the service pickup.", "Clicked, then nothing. Jumped.", "", "Driver called it in from the salt barn.", ""];
const SLOW_NOTES = ["Cranked slow, caught on the third try.", "Slow, but it started.", "Cranked long before it caught."];

/** Moves a day back to the Monday on or before it, in the shop's days (a soak over a weekend ends on a Monday morning). */
function mondayOnOrBefore(ctx: SeedContext, days: number): number {
  const weekday = new Date(ctx.now.getTime() - days * DAY).getUTCDay(); // 0 Sunday … 6 Saturday
  return days + ((weekday + 6) % 7);
}

/**
 * T-9's no-start: a key-off drain (found on this visit) flattens the batteries over a long park.
 * After a night in real cold, or any weekend, it will not start; after a milder night it cranks
 * slowly and catches. Temperatures follow the demo town's season for each date, so a September
 * morning is a September morning.
 */
export function t9NoStart(ctx: SeedContext): OccurrenceSeed[] {
  return T9_MORNINGS.map((m, i) => {
    const days = m.weekend ? mondayOnOrBefore(ctx, m.daysAgo) : m.daysAgo;
    const tempF = Math.round(usualMorningLowF(new Date(ctx.now.getTime() - days * DAY)) + m.off);
    const fails = m.parked >= 36 || (m.parked >= 10 && tempF <= 28);
    const volts = m.voltsRead ? Math.max(11.5, Math.min(12.4, Math.round((12.45 - 0.012 * m.parked - Math.max(0, 40 - tempF) * 0.006) * 10) / 10)) : null;
    const last = i === T9_MORNINGS.length - 1;
    const note = last
      ? "Booked it in with the shop after this one."
      : m.weekend
        ? fails
          ? "Sat through the weekend. Would not turn over; jumped."
          : "Monday after the weekend. Slow, but it started."
        : fails
          ? NO_START_NOTES[i % NO_START_NOTES.length]!
          : SLOW_NOTES[i % SLOW_NOTES.length]!;
    return {
      daysAgo: days,
      hour: 12 + (i % 2),
      hoursParked: m.parked,
      tempF,
      volts,
      symptom: fails ? "no_start" : "slow_crank",
      recovered: !fails,
      note,
      by: m.by,
    };
  });
}

const BUS_OFFICE = "transport@alder-falls-schools.example";

/** Bus 14's ABS lamp: comes on in wet weather on the depot turn, out after a restart. */
export function bus14AbsLamp(ctx: SeedContext): OccurrenceSeed[] {
  const runs = [
    { daysAgo: 26, hour: 21, parked: 0.5, afternoon: true, what: "turning left into the depot", after: "out after a restart." },
    { daysAgo: 17, hour: 13, parked: 1, afternoon: false, what: "on the morning run", after: "out by the next stop." },
    { daysAgo: 9, hour: 20, parked: 0.2, afternoon: true, what: "again on the depot turn", after: "out after a restart." },
    { daysAgo: 2, hour: 14, parked: null, afternoon: false, what: "flickered on the run; the driver did not stop", after: "" },
  ];
  return runs.map((r, i) => {
    const at = new Date(ctx.now.getTime() - r.daysAgo * DAY);
    const tempF = Math.round((r.afternoon ? usualAfternoonHighF(at) - 6 : usualMorningLowF(at) + 4) + (i % 2 ? -2 : 1));
    // Salt goes down only when the road can freeze.
    const road = tempF <= 34 ? "Wet, salted road" : "Wet road, raining";
    return {
      daysAgo: r.daysAgo,
      hour: r.hour,
      hoursParked: r.parked,
      tempF,
      volts: null,
      symptom: "warning_lamp" as const,
      recovered: r.after ? true : null,
      note: `${road}: came on ${r.what}${r.after ? `; ${r.after}` : "."}`,
      by: BUS_OFFICE,
    };
  });
}

async function insertLog(ctx: SeedContext, unitKey: string, account: string, concernId: string, log: OccurrenceSeed[]) {
  await ctx.db.insert(occurrences).values(
    log.map((o) => ({
      unitId: id(ctx, `unit:${unitKey}`),
      accountId: id(ctx, `account:${account}`),
      concernId,
      occurredAt: daysAgo(ctx, o.daysAgo, o.hour),
      hoursParked: o.hoursParked,
      ambientC: o.tempF === null ? null : celsiusFromFahrenheit(o.tempF),
      symptom: o.symptom,
      symptomText: o.symptomText ?? "",
      batteryVolts: o.volts,
      recovered: o.recovered,
      note: o.note,
      createdBy: id(ctx, `user:${o.by}`),
      createdAt: daysAgo(ctx, o.daysAgo, o.hour),
      updatedAt: daysAgo(ctx, o.daysAgo, o.hour),
    })),
  );
}

export async function seedOccurrences(ctx: SeedContext): Promise<void> {
  await insertLog(ctx, "T-9", "township", id(ctx, "concern:W-1043:0"), t9NoStart(ctx));

  // Bus 14 is not in the shop: the concern was raised on its last visit and stays open on the unit.
  const busId = id(ctx, "unit:BUS-14");
  const [lastVisit] = await ctx.db
    .select({ id: workOrders.id, openedAt: workOrders.openedAt })
    .from(workOrders)
    .where(and(eq(workOrders.unitId, busId), eq(workOrders.status, "released")))
    .orderBy(desc(workOrders.openedAt))
    .limit(1);
  const [concern] = await ctx.db
    .insert(concerns)
    .values({
      unitId: busId,
      workOrderId: lastVisit?.id ?? null,
      position: 1,
      complaint: "ABS lamp comes on now and then while driving, and goes out after a restart.",
      intermittent: true,
      recordHint: "Note the road (wet, salted or dry), which way the bus was turning, and whether the lamp went out after a restart.",
      createdBy: id(ctx, "user:writer@quarry-road.example"),
      createdAt: lastVisit?.openedAt ?? daysAgo(ctx, 30),
    })
    .returning({ id: concerns.id });
  ctx.ids.set("concern:BUS-14:abs", concern!.id);
  await insertLog(ctx, "BUS-14", "schools", concern!.id, bus14AbsLamp(ctx));
}
