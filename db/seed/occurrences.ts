import { and, desc, eq } from "drizzle-orm";
import { concerns, occurrences, workOrders } from "@/db/schema";
import { celsiusFromFahrenheit } from "@/lib/occurrences/temperature";
import type { Symptom } from "@/lib/occurrences/symptoms";
import { type SeedContext, daysAgo, id } from "./context";

interface OccurrenceSeed {
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

/**
 * T-9's no-start, a season of mornings: it fails after a long soak below about
 * 25 °F and starts (slowly) after a short stop or a milder weekend. Resting
 * voltage is low every time, which points the shop at a key-off drain.
 */
export const T9_NO_START: OccurrenceSeed[] = [
  { daysAgo: 98, hour: 12, hoursParked: 14, tempF: 21, volts: null, symptom: "slow_crank", recovered: true, note: "Cranked slow, caught on the third try.", by: FOREMAN },
  { daysAgo: 91, hour: 12, hoursParked: 13.5, tempF: 17, volts: null, symptom: "no_start", recovered: false, note: "Jumped it from the service pickup.", by: FOREMAN },
  { daysAgo: 84, hour: 13, hoursParked: 62, tempF: 33, volts: 12.2, symptom: "slow_crank", recovered: true, note: "Monday after a mild weekend. Slow, but it started.", by: SUPERVISOR },
  { daysAgo: 77, hour: 12, hoursParked: 15, tempF: 9, volts: 11.9, symptom: "no_start", recovered: false, note: "Clicked, then nothing. Jumped.", by: FOREMAN },
  { daysAgo: 70, hour: 12, hoursParked: 11, tempF: 14, volts: null, symptom: "no_start", recovered: false, note: "", by: FOREMAN },
  { daysAgo: 63, hour: 12, hoursParked: 8, tempF: 12, volts: 12.1, symptom: "slow_crank", recovered: true, note: "Parked at 10 p.m. after plowing; slow at 6 but it went.", by: FOREMAN },
  { daysAgo: 56, hour: 13, hoursParked: 16, tempF: -3, volts: 11.7, symptom: "no_start", recovered: false, note: "Coldest morning so far. Needed two jumps.", by: FOREMAN },
  { daysAgo: 49, hour: 12, hoursParked: 11.5, tempF: 19, volts: null, symptom: "no_start", recovered: false, note: "Driver called it in from the salt barn.", by: CLERK },
  { daysAgo: 42, hour: 13, hoursParked: 64, tempF: 6, volts: 11.6, symptom: "no_start", recovered: false, note: "After the holiday weekend. Would not turn over at all.", by: SUPERVISOR },
  { daysAgo: 35, hour: 12, hoursParked: 13, tempF: 23, volts: 12.0, symptom: "stalled", recovered: false, note: "Cranked slow, ran ten seconds, died. Jumped.", by: FOREMAN },
  { daysAgo: 28, hour: 12, hoursParked: 14, tempF: 2, volts: 11.8, symptom: "no_start", recovered: false, note: "", by: FOREMAN },
  { daysAgo: 21, hour: 12, hoursParked: 11.5, tempF: 16, volts: null, symptom: "no_start", recovered: false, note: "", by: FOREMAN },
  { daysAgo: 14, hour: 13, hoursParked: 38, tempF: 11, volts: 11.8, symptom: "no_start", recovered: false, note: "Sat through Sunday. Jumped.", by: FOREMAN },
  { daysAgo: 7, hour: 12, hoursParked: 15, tempF: 20, volts: 11.9, symptom: "no_start", recovered: false, note: "", by: SUPERVISOR },
  { daysAgo: 4, hour: 12, hoursParked: 14, tempF: -1, volts: 11.7, symptom: "no_start", recovered: false, note: "Booked it in with the shop after this one.", by: FOREMAN },
];

const BUS_OFFICE = "transport@alder-falls-schools.example";

/** Bus 14's ABS lamp: comes on in wet weather on the depot turn, out after a restart. */
export const BUS14_ABS_LAMP: OccurrenceSeed[] = [
  { daysAgo: 26, hour: 21, hoursParked: 0.5, tempF: 38, volts: null, symptom: "warning_lamp", recovered: true, note: "Came on turning left into the depot in the rain; out after a restart.", by: BUS_OFFICE },
  { daysAgo: 17, hour: 13, hoursParked: 1, tempF: 35, volts: null, symptom: "warning_lamp", recovered: true, note: "Wet, salted road on the morning run. Out by the next stop.", by: BUS_OFFICE },
  { daysAgo: 9, hour: 20, hoursParked: 0.2, tempF: 44, volts: null, symptom: "warning_lamp", recovered: true, note: "Again on the depot turn, raining.", by: BUS_OFFICE },
  { daysAgo: 2, hour: 14, hoursParked: null, tempF: 31, volts: null, symptom: "warning_lamp", recovered: null, note: "Driver saw it flicker; did not stop.", by: BUS_OFFICE },
];

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
  await insertLog(ctx, "T-9", "township", id(ctx, "concern:W-1043:0"), T9_NO_START);

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
  await insertLog(ctx, "BUS-14", "schools", concern!.id, BUS14_ABS_LAMP);
}
