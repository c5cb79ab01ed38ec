import { count, desc, eq, ne, sql } from "drizzle-orm";
import type { LibSQLDatabase } from "drizzle-orm/libsql";
import * as schema from "@/db/schema";
import type { AccountInfo, Kind, UnitInfo } from "./world";

const { accounts, counters, decisions, estimateLines, invoices, laborRates, meterReadings, shopSettings, units, users, workOrders } = schema;

export const TOWNSHIP_NAME = "Brennan Township Highway Department";

/** The demo data (db/seed) the big database grows from, as the generator needs it. */
export interface DemoWorld {
  accounts: AccountInfo[];
  units: UnitInfo[];
  township: AccountInfo;
  passwordHash: string;
  staff: { writer: string; techs: string[] };
  rates: { shop: string; diagnosis: string };
  shop: typeof shopSettings.$inferSelect;
  counts: { workOrders: number; open: number; townshipReleased: number; townshipOpen: number; lines: number; decisions: number; invoices: number };
  counters: { workOrder: number; invoice: number };
}

const KIND_OF: Record<string, Kind> = {
  [TOWNSHIP_NAME]: "roads",
  "Alder Falls School District Transportation": "schools",
  "Kettle Ridge Stone Co.": "aggregates",
};

export async function readDemo(db: LibSQLDatabase<typeof schema>): Promise<DemoWorld> {
  const userRows = await db.select().from(users);
  const byEmail = (email: string) => {
    const u = userRows.find((r) => r.email === email);
    if (!u) throw new Error(`demo user ${email} missing: is the demo seed loaded?`);
    return u;
  };
  const accountRows = await db.select().from(accounts);
  const contacts = await db.select().from(schema.accountContacts).where(eq(schema.accountContacts.isBilling, true));
  const demoAccounts: AccountInfo[] = accountRows.map((a) => {
    const approvers = userRows
      .filter((u) => u.accountId === a.id && u.role === "approver")
      .map((u) => ({ id: u.id, limitCents: u.signingLimitCents ?? 0 }))
      .sort((x, y) => x.limitCents - y.limitCents);
    return {
      id: a.id,
      name: a.name,
      kind: KIND_OF[a.name] ?? "roads",
      township: a.name === TOWNSHIP_NAME,
      demo: true,
      taxExempt: a.taxExempt,
      taxRateMilliPct: a.taxRateMilliPct,
      taxExemptCertificate: a.taxExemptCertificate,
      poRequired: a.poRequired,
      paymentTermsDays: a.paymentTermsDays,
      standingAuthorisationCents: a.standingAuthorisationCents,
      fiscalYearStartMonth: a.fiscalYearStartMonth,
      shopSuppliesExempt: a.shopSuppliesExempt,
      overrunPercentMilli: a.overrunPercentMilli,
      overrunCapCents: a.overrunCapCents,
      overrunFloorCents: a.overrunFloorCents,
      billingEmail: a.billingEmail,
      phone: a.phone,
      address: a.address,
      contactName: contacts.find((c) => c.accountId === a.id)?.name ?? "",
      approvers,
      clerkId: userRows.find((u) => u.accountId === a.id && u.role === "clerk")?.id ?? null,
      poPrefix: a.name.split(" ").map((p) => p[0]).join("").slice(0, 3),
    };
  });
  const township = demoAccounts.find((a) => a.township);
  if (!township) throw new Error(`the demo's ${TOWNSHIP_NAME} is missing`);

  const unitRows = await db.select().from(units);
  const latest = await db
    .select({ unitId: meterReadings.unitId, kind: meterReadings.kind, value: sql<number>`max(${meterReadings.value})` })
    .from(meterReadings)
    .groupBy(meterReadings.unitId, meterReadings.kind);
  const meter = (unitId: string, kind: "engine_hours" | "odometer") => latest.find((m) => m.unitId === unitId && m.kind === kind)?.value ?? 0;
  // The demo's readings are today's; the history starts six years of wear earlier.
  const demoUnits: UnitInfo[] = unitRows.map((u) => {
    const hours = meter(u.id, "engine_hours");
    const miles = meter(u.id, "odometer");
    return {
      id: u.id, accountId: u.accountId, unitNumber: u.unitNumber, description: u.description, year: u.year, vin: u.vin, serialNumber: u.serialNumber,
      hoursAtStart: Math.round(hours * 0.35), hoursPerDay: (hours * 0.55) / (6 * 365),
      milesAtStart: Math.round(miles * 0.35), milesPerDay: (miles * 0.55) / (6 * 365),
    };
  });

  const rateRows = await db.select().from(laborRates);
  const rate = (name: string) => rateRows.find((r) => r.name === name)?.id ?? "";
  const [shop] = await db.select().from(shopSettings).limit(1);
  if (!shop) throw new Error("demo shop settings missing");
  const one = async (q: Promise<{ n: number }[]>) => (await q)[0]?.n ?? 0;
  const counterRows = await db.select().from(counters);
  const counter = (name: string) => counterRows.find((c) => c.name === name)?.value ?? 0;
  const [maxWo] = await db.select({ n: workOrders.number }).from(workOrders).orderBy(desc(workOrders.number)).limit(1);

  return {
    accounts: demoAccounts,
    units: demoUnits,
    township,
    passwordHash: byEmail("writer@quarry-road.example").passwordHash,
    staff: { writer: byEmail("writer@quarry-road.example").id, techs: [byEmail("tech@quarry-road.example").id, byEmail("tech2@quarry-road.example").id] },
    rates: { shop: rate("Shop labour"), diagnosis: rate("Diagnosis") },
    shop,
    counts: {
      workOrders: await one(db.select({ n: count() }).from(workOrders)),
      open: await one(db.select({ n: count() }).from(workOrders).where(ne(workOrders.status, "released"))),
      townshipReleased: await one(
        db.select({ n: count() }).from(workOrders).where(sql`${workOrders.accountId} = ${township.id} and ${workOrders.status} = 'released'`),
      ),
      townshipOpen: await one(
        db.select({ n: count() }).from(workOrders).where(sql`${workOrders.accountId} = ${township.id} and ${workOrders.status} <> 'released'`),
      ),
      lines: await one(db.select({ n: count() }).from(estimateLines)),
      decisions: await one(db.select({ n: count() }).from(decisions)),
      invoices: await one(db.select({ n: count() }).from(invoices)),
    },
    counters: { workOrder: Math.max(counter("work_order"), maxWo?.n ?? 0), invoice: counter("invoice") },
  };
}

/** Units with an open visit in the demo (a unit has at most one at a time). */
export async function unitsInShop(db: LibSQLDatabase<typeof schema>): Promise<Set<string>> {
  const open = await db.select({ unitId: workOrders.unitId }).from(workOrders).where(ne(workOrders.status, "released"));
  return new Set(open.map((r) => r.unitId));
}
