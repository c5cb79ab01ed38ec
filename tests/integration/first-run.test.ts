import { rmSync } from "node:fs";
import path from "node:path";
import { count } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as setup } from "@/app/api/v1/setup/route";
import { closeDb, getDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { forgetSetupState, needsSetup } from "@/db/queries/setup";
import { counters, laborRates, shopSettings, users } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { call } from "./helpers/app";

// This file runs on an empty database of its own, not the demo one the set-up file loads.
const file = path.join(import.meta.dirname, "..", ".artifacts", "integration", `empty-${process.pid}-${Date.now()}.db`);
let demoUrl: string | undefined;
beforeAll(async () => {
  demoUrl = process.env.DATABASE_URL;
  await migrateDatabase(`file:${file}`);
  process.env.DATABASE_URL = `file:${file}`;
  resetEnvCache();
  forgetSetupState();
});
afterAll(() => {
  closeDb();
  process.env.DATABASE_URL = demoUrl;
  resetEnvCache();
  forgetSetupState();
  for (const suffix of ["", "-wal", "-shm"]) rmSync(`${file}${suffix}`, { force: true });
});

const shop = {
  shopName: "Millrace Diesel & Fleet",
  addressLine1: "40 Tannery Lane",
  addressLine2: "Harlow Bend",
  phone: "(555) 010-2290",
  laborRateCents: 13_500,
  ownerName: "Marta Quill",
  ownerEmail: "marta@millrace.example",
  password: "millrace-first-owner",
};

describe("first run on an empty database", () => {
  it("refuses bad input with field errors and writes nothing", async () => {
    expect(await needsSetup()).toBe(true);
    const res = await call(setup, { path: "/api/v1/setup", body: { ...shop, shopName: "", laborRateCents: 0, password: "short" } });
    expect(res.status).toBe(400);
    expect(res.body.errors?.map((e) => e.path).sort()).toEqual(["laborRateCents", "password", "shopName"]);
    const [n] = await getDb().select({ n: count() }).from(users);
    expect(n!.n).toBe(0);
    expect(await getDb().select().from(shopSettings)).toHaveLength(0);
  });

  it("two set-ups at once: exactly one makes the shop, the other is 409; after that it is gone for good", async () => {
    const [a, b] = await Promise.all([
      call(setup, { path: "/api/v1/setup", body: shop }),
      call(setup, { path: "/api/v1/setup", body: { ...shop, ownerEmail: "someone-else@millrace.example" } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect([a.body.code, b.body.code]).toContain("already_set_up");
    const people = await getDb().select({ email: users.email, role: users.role }).from(users);
    expect(people).toHaveLength(1);
    expect(people[0]!.role).toBe("owner");
    const [s] = await getDb().select().from(shopSettings);
    expect(s!.shopName).toBe("Millrace Diesel & Fleet");
    const rates = await getDb().select().from(laborRates);
    expect(rates).toEqual([expect.objectContaining({ rateCents: 13_500, isDefault: true })]);
    expect((await getDb().select().from(counters)).map((c) => c.name).sort()).toEqual(["invoice", "work_order"]);
    expect(await needsSetup()).toBe(false);

    // Even after this process forgets, the database says no.
    forgetSetupState();
    const later = await call(setup, { path: "/api/v1/setup", body: { ...shop, ownerEmail: "third@millrace.example" } });
    expect(later.status).toBe(409);
    expect(later.body.code).toBe("already_set_up");
  });
});
