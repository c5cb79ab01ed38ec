import { and, desc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as addReading } from "@/app/api/v1/units/[id]/meter-readings/route";
import { getDb } from "@/db/client";
import { meterReadings, signInFailures, units } from "@/db/schema";
import { authOptions } from "@/lib/auth/options";
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

describe("sign-in", () => {
  const authorize = () => {
    const provider = authOptions().providers[0] as unknown as {
      options: { authorize: (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown> };
    };
    return provider.options.authorize;
  };

  it("signs in a demo user with the demo password and refuses a wrong one", async () => {
    const req = { headers: { "x-forwarded-for": "203.0.113.7" } };
    await expect(authorize()({ email: "Supervisor@Brennan-Twp.example", password: "cotter-demo" }, req)).resolves.toMatchObject({ role: "approver" });
    await expect(authorize()({ email: "supervisor@brennan-twp.example", password: "wrong" }, req)).resolves.toBeNull();
    await expect(authorize()({ email: "nobody@brennan-twp.example", password: "cotter-demo" }, req)).resolves.toBeNull();
  });

  it("locks an address out after ten failures in fifteen minutes, even with the right password", async () => {
    const ip = "198.51.100.23";
    const now = Date.now();
    await getDb()
      .insert(signInFailures)
      .values(Array.from({ length: 10 }, (_, i) => ({ ip, email: "x@example.com", at: new Date(now - i * 30_000).toISOString() })));
    await expect(authorize()({ email: "owner@quarry-road.example", password: "cotter-demo" }, { headers: { "x-forwarded-for": ip } })).rejects.toThrow(
      /Too many failed sign-ins from this address\. Try again in \d+ minutes?/,
    );
    // Another address is unaffected.
    await expect(
      authorize()({ email: "owner@quarry-road.example", password: "cotter-demo" }, { headers: { "x-forwarded-for": "198.51.100.24" } }),
    ).resolves.toMatchObject({ role: "owner" });
  });
});
