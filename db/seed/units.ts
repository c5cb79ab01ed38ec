import { meterReadings, units } from "@/db/schema";
import { withCheckDigit } from "@/lib/vin";
import { type SeedContext, daysAgo, dateOnly, id } from "./context";

// Demo VINs use the made-up manufacturer prefix "0CT": region 0 is assigned to
// no country, so no demo VIN names a real maker. Position 10 is the model-year
// code (49 CFR 565.15(a)); position 9 is filled in by withCheckDigit.
const YEAR_CODE: Record<number, string> = {
  2011: "B", 2012: "C", 2013: "D", 2014: "E", 2015: "F", 2016: "G", 2017: "H",
  2018: "J", 2019: "K", 2020: "L", 2021: "M", 2022: "N", 2023: "P",
};

function demoVin(body: string, year: number, serial: number): string {
  const code = YEAR_CODE[year];
  if (!code) throw new Error(`no year code for ${year}`);
  return withCheckDigit(`0CT${body}10${code}A${String(serial).padStart(6, "0")}`);
}

interface UnitSeed {
  key: string;
  account: "township" | "schools" | "quarry";
  unitNumber: string;
  year: number;
  description: string;
  plate: string;
  body?: string;
  serial?: string;
  odometer?: number;
  hours: number;
  inspectedDaysAgo: number;
  drainLimitMa?: number;
}

export const UNIT_SEEDS: UnitSeed[] = [
  { key: "T-14", account: "township", unitNumber: "T-14", year: 2014, description: "Tandem-axle dump with front plow and side wing", plate: "BT-1014", body: "DT45", odometer: 118_420, hours: 9_412, inspectedDaysAgo: 300, drainLimitMa: 150 },
  { key: "T-9", account: "township", unitNumber: "T-9", year: 2011, description: "Single-axle dump with front plow and salt spreader", plate: "BT-1009", body: "DS31", odometer: 164_880, hours: 12_906, inspectedDaysAgo: 355, drainLimitMa: 120 },
  { key: "T-17", account: "township", unitNumber: "T-17", year: 2019, description: "Tandem-axle dump with underbody scraper and wing", plate: "BT-1017", body: "DT47", odometer: 61_305, hours: 4_210, inspectedDaysAgo: 140 },
  { key: "T-21", account: "township", unitNumber: "T-21", year: 2022, description: "Three-quarter-ton pickup with liftgate and light bar", plate: "BT-1021", body: "PK22", odometer: 38_116, hours: 1_870, inspectedDaysAgo: 60 },
  { key: "L-3", account: "township", unitNumber: "L-3", year: 2012, description: "Wheel loader, 3.5 cu yd bucket, quick coupler", plate: "", serial: "WL35-0012874", hours: 11_390, inspectedDaysAgo: 220 },
  { key: "G-2", account: "township", unitNumber: "G-2", year: 2016, description: "Motor grader with front blade and ripper", plate: "", serial: "MG14-0004410", hours: 6_744, inspectedDaysAgo: 180 },
  { key: "T-5", account: "township", unitNumber: "T-5", year: 2017, description: "Tandem-axle dump with front plow", plate: "BT-1005", body: "DT45", odometer: 97_752, hours: 7_015, inspectedDaysAgo: 330 },
  { key: "BUS-22", account: "schools", unitNumber: "Bus 22", year: 2018, description: "72-passenger conventional school bus, air brakes", plate: "SB-2218", body: "SB72", odometer: 88_904, hours: 4_980, inspectedDaysAgo: 170 },
  { key: "BUS-9", account: "schools", unitNumber: "Bus 9", year: 2015, description: "66-passenger conventional school bus, air brakes", plate: "SB-2209", body: "SB66", odometer: 131_277, hours: 7_402, inspectedDaysAgo: 345 },
  { key: "BUS-31", account: "schools", unitNumber: "Bus 31", year: 2021, description: "Wheelchair-lift school bus, 48 passengers", plate: "SB-2231", body: "SL48", odometer: 42_630, hours: 2_311, inspectedDaysAgo: 90 },
  { key: "BUS-14", account: "schools", unitNumber: "Bus 14", year: 2016, description: "72-passenger transit-style school bus, rear engine", plate: "SB-2214", body: "ST72", odometer: 119_045, hours: 6_650, inspectedDaysAgo: 250 },
  { key: "VAN-3", account: "schools", unitNumber: "Van 3", year: 2020, description: "14-passenger activity van", plate: "SB-2303", body: "AV14", odometer: 55_212, hours: 2_004, inspectedDaysAgo: 200 },
  { key: "H-7", account: "quarry", unitNumber: "Haul 7", year: 2013, description: "Tri-axle dump, 20 cu yd body, air brakes", plate: "KR-4407", body: "DX62", odometer: 212_560, hours: 15_870, inspectedDaysAgo: 290 },
  { key: "H-5", account: "quarry", unitNumber: "Haul 5", year: 2019, description: "Tandem-axle tractor with end-dump trailer", plate: "KR-4405", body: "TR61", odometer: 174_005, hours: 9_980, inspectedDaysAgo: 120 },
  { key: "LD-2", account: "quarry", unitNumber: "Loader 2", year: 2014, description: "Wheel loader, 5 cu yd rock bucket", plate: "", serial: "WL50-0031190", hours: 14_225, inspectedDaysAgo: 400 },
  { key: "W-1", account: "quarry", unitNumber: "Water 1", year: 2012, description: "Water truck, 4,000 gal tank with spray bar", plate: "KR-4401", body: "WT40", odometer: 143_818, hours: 10_455, inspectedDaysAgo: 260 },
];

function addMonths(iso: string, months: number): string {
  const d = new Date(`${iso}T12:00:00Z`);
  d.setUTCMonth(d.getUTCMonth() + months);
  return dateOnly(d.toISOString());
}

export async function seedUnits(ctx: SeedContext): Promise<void> {
  let serial = 100_211;
  for (const u of UNIT_SEEDS) {
    const lastInspectionOn = dateOnly(daysAgo(ctx, u.inspectedDaysAgo));
    const [row] = await ctx.db
      .insert(units)
      .values({
        accountId: id(ctx, `account:${u.account}`),
        unitNumber: u.unitNumber,
        vin: u.body ? demoVin(u.body, u.year, (serial += 7919)) : null,
        serialOnly: !u.body,
        serialNumber: u.serial ?? null,
        year: u.year,
        description: u.description,
        plate: u.plate,
        lastInspectionOn,
        // 49 CFR 396.17: periodic inspection at least every 12 months.
        inspectionDueOn: addMonths(lastInspectionOn, 12),
        keyOffDrainLimitMa: u.drainLimitMa ?? null,
        createdAt: daysAgo(ctx, 900),
        updatedAt: daysAgo(ctx, 30),
      })
      .returning({ id: units.id });
    ctx.ids.set(`unit:${u.key}`, row!.id);

    // A year of readings, climbing, so the history reads like a real unit's.
    const readings = [365, 180, 30].flatMap((ago, i) => {
      const share = [0.9, 0.95, 1][i]!;
      const out: { unitId: string; kind: "engine_hours" | "odometer"; value: number; readAt: string }[] = [
        { unitId: row!.id, kind: "engine_hours", value: Math.round(u.hours * share), readAt: daysAgo(ctx, ago, 14) },
      ];
      if (u.odometer) out.push({ unitId: row!.id, kind: "odometer", value: Math.round(u.odometer * share), readAt: daysAgo(ctx, ago, 14) });
      return out;
    });
    await ctx.db.insert(meterReadings).values(readings);
  }
}
