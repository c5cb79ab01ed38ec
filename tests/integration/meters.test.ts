import { and, desc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as addReading } from "@/app/api/v1/units/[id]/meter-readings/route";
import { getDb } from "@/db/client";
import { meterReadings, units } from "@/db/schema";
import { call } from "./helpers/app";

async function unitWithOdometer(unitNumber: string) {
  const [unit] = await getDb().select().from(units).where(eq(units.unitNumber, unitNumber)).limit(1);
  const [lastOdometer] = await getDb()
    .select()
    .from(meterReadings)
    .where(and(eq(meterReadings.unitId, unit!.id), eq(meterReadings.kind, "odometer")))
    .orderBy(desc(meterReadings.readAt))
    .limit(1);
  return { unit: unit!, lastOdometer: lastOdometer! };
}

describe("meter readings only go up (a lower reading needs a meter change)", () => {
  it("refuses a lower odometer reading with a clear 400 and keeps the history unchanged", async () => {
    const { unit, lastOdometer } = await unitWithOdometer("T-14");
    const before = await getDb().select().from(meterReadings).where(eq(meterReadings.unitId, unit.id));
    const res = await call(addReading, {
      path: `/api/v1/units/${unit.id}/meter-readings`,
      params: { id: unit.id },
      as: "writer@quarry-road.example",
      body: { kind: "odometer", value: lastOdometer.value - 100 },
    });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe("invalid_input");
    expect(res.body.detail).toMatch(/lower than the last reading/);
    expect(res.body.errors?.[0]?.path).toBe("value");
    const after = await getDb().select().from(meterReadings).where(eq(meterReadings.unitId, unit.id));
    expect(after).toHaveLength(before.length);
  });

  it("accepts a higher reading, and a lower one marked as a meter change", async () => {
    const { unit, lastOdometer } = await unitWithOdometer("T-14");
    const up = await call<{ value: number }>(addReading, {
      path: `/api/v1/units/${unit.id}/meter-readings`,
      params: { id: unit.id },
      as: "tech@quarry-road.example",
      body: { kind: "odometer", value: lastOdometer.value + 250 },
    });
    expect(up.status).toBe(201);
    const replaced = await call<{ value: number; meterReplaced: boolean }>(addReading, {
      path: `/api/v1/units/${unit.id}/meter-readings`,
      params: { id: unit.id },
      as: "tech@quarry-road.example",
      body: { kind: "odometer", value: 12, meterReplaced: true },
    });
    expect(replaced.status).toBe(201);
    expect(replaced.body).toMatchObject({ value: 12, meterReplaced: true });
  });

  it("404s another account's unit and 400s malformed bodies without writing", async () => {
    const { unit } = await unitWithOdometer("Bus 22");
    const other = await call(addReading, {
      path: `/api/v1/units/${unit.id}/meter-readings`,
      params: { id: unit.id },
      as: "foreman@brennan-twp.example",
      body: { kind: "odometer", value: 999_999 },
    });
    expect(other.status).toBe(404);
    for (const body of ["{not json", JSON.stringify({ kind: "speedo", value: 1 }), JSON.stringify({ kind: "odometer", value: -5 }), JSON.stringify([1])]) {
      const res = await call(addReading, { path: `/api/v1/units/${unit.id}/meter-readings`, params: { id: unit.id }, as: "writer@quarry-road.example", body });
      expect([400].includes(res.status), body).toBe(true);
    }
    const wrongType = await call(addReading, {
      path: `/api/v1/units/${unit.id}/meter-readings`,
      params: { id: unit.id },
      as: "writer@quarry-road.example",
      body: "kind=odometer",
      headers: { "content-type": "text/plain" },
    });
    expect(wrongType.status).toBe(415);
    const huge = await call(addReading, {
      path: `/api/v1/units/${unit.id}/meter-readings`,
      params: { id: unit.id },
      as: "writer@quarry-road.example",
      body: { kind: "odometer", value: 1, note: "x".repeat(70_000) },
    });
    expect(huge.status).toBe(413);
  });
});
