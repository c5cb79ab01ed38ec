import { count, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as importCsv } from "@/app/api/v1/accounts/[id]/units/import/route";
import { GET as getUnit, PATCH as patchUnit } from "@/app/api/v1/units/[id]/route";
import { GET as listUnits, POST as addUnit } from "@/app/api/v1/units/route";
import { getClient, getDb } from "@/db/client";
import { accounts, meterReadings, units } from "@/db/schema";
import { withCheckDigit } from "@/lib/vin";
import { call } from "./helpers/app";

const WRITER = "writer@quarry-road.example";
const FLEET = ["supervisor@brennan-twp.example", "clerk@brennan-twp.example", "foreman@brennan-twp.example"];

async function accountId(name: string) {
  const [a] = await getDb().select({ id: accounts.id }).from(accounts).where(eq(accounts.name, name));
  return a!.id;
}
async function unitCount() {
  const [row] = await getDb().select({ n: count() }).from(units);
  return row!.n;
}

type UnitRow = { id: string; unitNumber: string; vin: string | null; inspectionDueOn: string | null; retiredAt: string | null };
type UnitList = { units: { id: string; unitNumber: string; vin: string | null; accountName: string }[]; nextCursor: string | null };

describe("adding a unit: VIN check digit by 49 CFR 565.15(c)", () => {
  it("accepts the worked examples of reference-values.md (Table VI sample 411 → 4; textbook 351 → X; all ones 89 → 1)", async () => {
    const kettle = await accountId("Kettle Ridge Stone Co.");
    for (const [n, vin] of [["Haul 20", "1G4AH59H45G118341"], ["Haul 21", "1m8gdm9a-xkp042788"], ["Haul 22", "11111111111111111"]] as const) {
      const res = await call<UnitRow>(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: n, vin, description: "Tri-axle dump" } });
      expect(res.status, vin).toBe(201);
      // Stored as a VIN is written: upper case, no separators.
      expect(res.body.vin).toBe(vin.toUpperCase().replace(/-/g, ""));
    }
  });

  it("refuses each kind of VIN error with a field error, naming the check digit the VIN should carry", async () => {
    const kettle = await accountId("Kettle Ridge Stone Co.");
    const before = await unitCount();
    const cases: [string, RegExp][] = [
      // The Table VI sample with position 9 changed from 4 to 5: the message names 4.
      ["1G4AH59H55G118341", /Position 9 should be 4/],
      // The textbook example with position 9 changed from X to 1: the message names X.
      ["1M8GDM9A1KP042788", /Position 9 should be X/],
      ["1G4AH59H45G11834", /17 characters; this one has 16/],
      ["1G4AH59H45G1183410", /17 characters; this one has 18/],
      ["1G4AH59H45G11834I", /never contain I, O or Q \(found I at position 17\)/],
      ["1G4AO59H45G118341", /found O at position 5/],
      ["1G4AQ59H45G118341", /found Q at position 5/],
      ["1G4AH59H45G11834*", /only the letters A–Z and the digits 0–9 \(found \* at position 17\)/],
    ];
    for (const [vin, message] of cases) {
      const res = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: `V ${vin}`, vin, description: "Test" } });
      expect(res.status, vin).toBe(400);
      const err = res.body.errors?.find((e) => e.path === "vin");
      expect(err?.message, vin).toMatch(message);
    }
    expect(await unitCount()).toBe(before);
  });

  it("“no VIN, serial only” is an explicit choice with its serial, never a silent pass", async () => {
    const kettle = await accountId("Kettle Ridge Stone Co.");
    const noVin = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: "Crusher 1", description: "Portable jaw crusher" } });
    expect(noVin.status).toBe(400);
    expect(noVin.body.errors?.[0]?.path).toBe("vin");
    const noSerial = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: "Crusher 1", serialOnly: true, description: "Portable jaw crusher" } });
    expect(noSerial.body.errors?.[0]?.path).toBe("serial");
    const both = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: "Crusher 1", serialOnly: true, serial: "JC-1", vin: "11111111111111111", description: "x" } });
    expect(both.body.errors?.[0]?.path).toBe("vin");
    const ok = await call<UnitRow>(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: "Crusher 1", serialOnly: true, serial: "JC-40-0071", description: "Portable jaw crusher", engineHours: 3_120 } });
    expect(ok.status).toBe(201);
    expect(ok.body.vin).toBeNull();
  });

  it("keeps readings, the inspection basis and due date (49 CFR 396.17(c) and (f)), and the accepted drain figure", async () => {
    const kettle = await accountId("Kettle Ridge Stone Co.");
    const periodic = await call(addUnit, {
      path: "/api/v1/units",
      as: WRITER,
      body: { accountId: kettle, unitNumber: "Water 2", vin: "11111111111111111".replace(/^1/, "2").replace(/^(.{8})./, "$1X"), description: "Water truck", odometer: 48_200, engineHours: 2_210, lastInspectionOn: "2025-03-14", inspectionBasis: "periodic", keyOffDrainLimitMa: 180 },
    });
    // (That VIN's own check digit is not X; the API names the right one.)
    expect(periodic.status).toBe(400);
    const expected = periodic.body.errors![0]!.message.match(/Position 9 should be (\w)/)![1]!;
    const fixed = `2111111${"1"}${expected}11111111`;
    const res = await call<UnitRow & { keyOffDrainLimitMa: number }>(addUnit, {
      path: "/api/v1/units",
      as: WRITER,
      body: { accountId: kettle, unitNumber: "Water 2", vin: fixed, description: "Water truck", odometer: 48_200, engineHours: 2_210, lastInspectionOn: "2025-03-14", inspectionBasis: "periodic", keyOffDrainLimitMa: 180 },
    });
    expect(res.status).toBe(201);
    // 396.17(c): 12 months from the day.
    expect(res.body.inspectionDueOn).toBe("2026-03-14");
    expect(res.body.keyOffDrainLimitMa).toBe(180);
    const readings = await getDb().select().from(meterReadings).where(eq(meterReadings.unitId, res.body.id));
    expect(readings.map((r) => [r.kind, r.value]).sort()).toEqual([["engine_hours", 2_210], ["odometer", 48_200]]);
    // 396.17(f): a state inspection counts to the end of the month, 12 months on.
    const state = await call<UnitRow>(patchUnit, { path: `/api/v1/units/${res.body.id}`, as: WRITER, method: "PATCH", params: { id: res.body.id }, body: { inspectionBasis: "state" } });
    expect(state.body.inspectionDueOn).toBe("2026-03-31");
    // The lower-reading rule applies to edits too.
    const lower = await call(patchUnit, { path: `/api/v1/units/${res.body.id}`, as: WRITER, method: "PATCH", params: { id: res.body.id }, body: { odometer: 40_000 } });
    expect(lower.status).toBe(400);
    expect(lower.body.errors?.[0]?.path).toBe("odometer");
  });

  it("unit numbers are unique within an account; a retired unit gives its number back and leaves the lists", async () => {
    const kettle = await accountId("Kettle Ridge Stone Co.");
    const dup = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: "haul 7", serialOnly: true, serial: "S-1", description: "x" } });
    expect(dup.status).toBe(400);
    expect(dup.body.errors?.[0]).toMatchObject({ path: "unitNumber", message: "This account already has a unit haul 7." });
    // Another account may use the same number.
    const schools = await accountId("Alder Falls School District Transportation");
    expect((await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: schools, unitNumber: "Haul 7", serialOnly: true, serial: "S-2", description: "Spare" } })).status).toBe(201);

    const [old] = await getDb().select().from(units).where(eq(units.unitNumber, "Crusher 1"));
    const retired = await call<UnitRow>(patchUnit, { path: `/api/v1/units/${old!.id}`, as: WRITER, method: "PATCH", params: { id: old!.id }, body: { retired: true } });
    expect(retired.body.retiredAt).not.toBeNull();
    const listed = await call<UnitList>(listUnits, { path: "/api/v1/units?limit=200", as: WRITER });
    expect(listed.body.units.map((u) => u.id)).not.toContain(old!.id);
    const withRetired = await call<UnitList>(listUnits, { path: "/api/v1/units?limit=200&retired=true", as: WRITER });
    expect(withRetired.body.units.map((u) => u.id)).toEqual([old!.id]);
    // Still in history: the unit itself still opens.
    expect((await call(getUnit, { path: `/api/v1/units/${old!.id}`, as: WRITER, params: { id: old!.id } })).status).toBe(200);
    const again = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: kettle, unitNumber: "Crusher 1", serialOnly: true, serial: "JC-40-0099", description: "Replacement crusher" } });
    expect(again.status).toBe(201);
  });

  it("only the owner and writers add or change units; bad types are a 400; unknown ids 404", async () => {
    const brennan = await accountId("Brennan Township Highway Department");
    const [t14] = await getDb().select().from(units).where(eq(units.unitNumber, "T-14"));
    for (const who of ["tech@quarry-road.example", ...FLEET]) {
      expect((await call(addUnit, { path: "/api/v1/units", as: who, body: { accountId: brennan, unitNumber: "Z", serialOnly: true, serial: "Z", description: "Z" } })).status, who).toBe(403);
      expect((await call(patchUnit, { path: `/api/v1/units/${t14!.id}`, as: who, method: "PATCH", params: { id: t14!.id }, body: { plate: "X" } })).status, who).toBe(403);
    }
    const bad = await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: brennan, unitNumber: "Y", serialOnly: true, serial: "Y", description: "Y", year: "soon", odometer: -4 } });
    expect(bad.status).toBe(400);
    expect(bad.body.errors?.map((e) => e.path).sort()).toEqual(["odometer", "year"]);
    expect((await call(addUnit, { path: "/api/v1/units", as: WRITER, body: { accountId: "nope", unitNumber: "Y", serialOnly: true, serial: "Y", description: "Y" } })).body.errors?.[0]?.path).toBe("accountId");
    expect((await call(patchUnit, { path: "/api/v1/units/nope", as: WRITER, method: "PATCH", params: { id: "nope" }, body: { plate: "X" } })).status).toBe(404);
    expect((await call(patchUnit, { path: `/api/v1/units/${t14!.id}`, as: WRITER, method: "PATCH", params: { id: t14!.id }, body: { colour: "red" } })).status).toBe(400);
  });
});

describe("importing units from CSV: a preview of every row's problems, then all rows or none", () => {
  const header = "unitNumber,vin,serialOnly,serial,year,description,plate,odometer,engineHours,lastInspectionOn,inspectionBasis";
  // Invented VINs (the unassigned "0CT" prefix the demo uses) with their check digits filled in.
  const vin40 = withCheckDigit("0CTSB7210KA300040");
  const vin41 = withCheckDigit("0CTSB6610LA300041");
  const good = [
    `Bus 40,${vin40},,,2019,72-passenger school bus,SB-2240,51200,2400,2025-08-01,state`,
    `Bus 41,${vin41.toLowerCase()},,,2020,Activity bus,SB-2241,30100,1500,,`,
    '"Cart 2",,yes,GC-2231,2016,"Grounds cart, electric",,,820,,',
  ];

  it("one bad row (a wrong check digit, a duplicate number, a missing description) refuses the whole file and names each problem", async () => {
    const schools = await accountId("Alder Falls School District Transportation");
    const before = await unitCount();
    const csv = [header, ...good, "Bus 42,1G4AH59H55G118341,,,2015,Route bus,,,,,", "Bus 40,,yes,X-1,2012,Spare,,,,,", "Bus 43,,yes,X-2,2012,,,,,,"].join("\r\n");
    const res = await call<{ errors: { row: number; field: string; message: string }[]; detail: string }>(importCsv, {
      path: `/api/v1/accounts/${schools}/units/import`,
      as: WRITER,
      params: { id: schools },
      body: csv,
      headers: { "content-type": "text/csv" },
    });
    expect(res.status).toBe(400);
    expect(res.body.detail).toMatch(/Nothing was imported/);
    expect(res.body.errors).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ row: 5, field: "vin", message: expect.stringMatching(/Position 9 should be 4/) }),
        expect.objectContaining({ row: 6, field: "unitNumber", message: "Unit number Bus 40 is also on line 2." }),
        expect.objectContaining({ row: 7, field: "description" }),
      ]),
    );
    expect(await unitCount()).toBe(before);
  });

  it("a number already on the account is a problem too; the fixed file imports every row", async () => {
    const schools = await accountId("Alder Falls School District Transportation");
    const clash = await call<{ errors: { row: number; field: string }[] }>(importCsv, {
      path: `/api/v1/accounts/${schools}/units/import`,
      as: WRITER,
      params: { id: schools },
      body: [header, ...good, "Bus 22,,yes,S-9,2010,Old bus,,,,,"].join("\n"),
      headers: { "content-type": "text/csv" },
    });
    expect(clash.status).toBe(400);
    expect(clash.body.errors).toEqual([expect.objectContaining({ row: 5, field: "unitNumber" })]);

    const before = await unitCount();
    const res = await call<{ imported: number }>(importCsv, {
      path: `/api/v1/accounts/${schools}/units/import`,
      as: WRITER,
      params: { id: schools },
      body: [header, ...good].join("\n"),
      headers: { "content-type": "text/csv" },
    });
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(3);
    expect(await unitCount()).toBe(before + 3);
    const [cart] = await getDb().select().from(units).where(eq(units.unitNumber, "Cart 2"));
    expect(cart).toMatchObject({ serialOnly: true, serialNumber: "GC-2231", description: "Grounds cart, electric", vin: null });
    const [bus] = await getDb().select().from(units).where(eq(units.unitNumber, "Bus 40"));
    expect(bus!.inspectionDueOn).toBe("2026-08-31");
  });

  it("refuses what is not CSV, a header without the needed columns, another role, and an unknown account", async () => {
    const schools = await accountId("Alder Falls School District Transportation");
    const path = `/api/v1/accounts/${schools}/units/import`;
    expect((await call(importCsv, { path, as: WRITER, params: { id: schools }, body: { csv: "x" } })).status).toBe(415);
    const noCols = await call(importCsv, { path, as: WRITER, params: { id: schools }, body: "name,colour\nA,red", headers: { "content-type": "text/csv" } });
    expect(noCols.status).toBe(400);
    expect(noCols.body.errors?.map((e) => e.path)).toEqual(["row 1.unitNumber", "row 1.description"]);
    expect((await call(importCsv, { path, as: "transport@alder-falls-schools.example", params: { id: schools }, body: header, headers: { "content-type": "text/csv" } })).status).toBe(403);
    expect((await call(importCsv, { path: "/api/v1/accounts/nope/units/import", as: WRITER, params: { id: "nope" }, body: `${header}\n${good[0]}`, headers: { "content-type": "text/csv" } })).status).toBe(404);
  });
});

describe("finding units: any 4+ characters of a VIN, plate, number, description or account, from an index", () => {
  it("matches a VIN fragment anywhere in it, case-insensitively, in the caller's scope only", async () => {
    const [t14] = await getDb().select().from(units).where(eq(units.unitNumber, "T-14"));
    const fragment = t14!.vin!.slice(9, 14).toLowerCase();
    const shop = await call<UnitList>(listUnits, { path: `/api/v1/units?q=${fragment}`, as: WRITER });
    expect(shop.body.units.map((u) => u.unitNumber)).toContain("T-14");
    const own = await call<UnitList>(listUnits, { path: `/api/v1/units?q=${fragment}`, as: "supervisor@brennan-twp.example" });
    expect(own.body.units.map((u) => u.unitNumber)).toContain("T-14");
    const other = await call<UnitList>(listUnits, { path: `/api/v1/units?q=${fragment}`, as: "office@kettle-ridge.example" });
    expect(other.body.units).toEqual([]);
  });

  it("matches plate, description words, account name and a short unit-number prefix; filters combine", async () => {
    const byPlate = await call<UnitList>(listUnits, { path: "/api/v1/units?q=SB-2214", as: WRITER });
    expect(byPlate.body.units.map((u) => u.unitNumber)).toEqual(["Bus 14"]);
    const words = await call<UnitList>(listUnits, { path: "/api/v1/units?q=plow%20wing", as: WRITER });
    expect(words.body.units.map((u) => u.unitNumber).sort()).toEqual(["T-14"]);
    const account = await call<UnitList>(listUnits, { path: "/api/v1/units?q=kettle&limit=200", as: WRITER });
    expect(new Set(account.body.units.map((u) => u.accountName))).toEqual(new Set(["Kettle Ridge Stone Co."]));
    const prefix = await call<UnitList>(listUnits, { path: "/api/v1/units?q=T-&limit=200", as: "supervisor@brennan-twp.example" });
    expect(prefix.body.units.every((u) => u.unitNumber.startsWith("T-"))).toBe(true);
    const inShop = await call<UnitList>(listUnits, { path: "/api/v1/units?q=dump&inShop=true&limit=200", as: WRITER });
    // Haul 5 pulls an end-dump trailer: "dump" is in its description too.
    expect(inShop.body.units.map((u) => u.unitNumber).sort()).toEqual(["Haul 5", "Haul 7", "T-14", "T-9"]);
    const quoted = await call<UnitList>(listUnits, { path: `/api/v1/units?q=${encodeURIComponent('"); drop')}`, as: WRITER });
    expect(quoted.status).toBe(200);
  });

  it("the VIN search is answered from the trigram index, not a scan of the units", async () => {
    const plan = await getClient().execute({
      sql: "explain query plan select id from units where id in (select unit_id from unit_search where unit_search match ?)",
      args: ['"A108"'],
    });
    const detail = plan.rows.map((r) => String(r.detail)).join("\n");
    expect(detail).toMatch(/VIRTUAL TABLE INDEX \d+:M/);
    expect(detail).not.toMatch(/SCAN units/);
  });
});
