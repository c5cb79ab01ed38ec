import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as list, POST as post } from "@/app/api/v1/units/[id]/occurrences/route";
import { GET as getOne, PATCH as patch } from "@/app/api/v1/units/[id]/occurrences/[occurrenceId]/route";
import { getDb } from "@/db/client";
import { closeConcern, markIntermittent } from "@/db/queries/intermittent-concerns";
import { concerns, mailOutbox, occurrences, units } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { celsiusFromFahrenheit } from "@/lib/occurrences/temperature";
import { call, userByEmail, type Problem } from "./helpers/app";
import { fileMailbox } from "./helpers/mail";

const FOREMAN = "foreman@brennan-twp.example"; // viewer, township
const SUPERVISOR = "supervisor@brennan-twp.example"; // approver, township
const CLERK = "clerk@brennan-twp.example";
const BUS_OFFICE = "transport@alder-falls-schools.example"; // approver, schools
const TECH = "tech@quarry-road.example";
const WRITER = "writer@quarry-road.example";

interface Entry {
  id: string;
  unitId: string;
  concernId: string | null;
  occurredAt: string;
  hoursParked: number | null;
  ambientC: number | null;
  symptom: string;
  symptomText: string;
  batteryVolts: number | null;
  recovered: boolean | null;
  note: string;
  createdBy: { id: string; name: string } | null;
  canEdit: boolean;
}
interface Log {
  occurrences: Entry[];
  nextCursor: string | null;
  concerns: { id: string; complaint: string; recordHint: string; closedAt: string | null; conclusion: string }[];
}

const smtp = fileMailbox();
let t9: string;
let bus14: string;
let t9Concern: string;

async function unitId(unitNumber: string) {
  const [u] = await getDb().select({ id: units.id }).from(units).where(eq(units.unitNumber, unitNumber)).limit(1);
  return u!.id;
}

const now = () => new Date().toISOString();
const minutesFromNow = (m: number) => new Date(Date.now() + m * 60_000).toISOString();

let posted = 0;
async function postAs(as: string | null, unit: string, body: unknown) {
  const res = await call<Entry & Problem>(post, { path: `/api/v1/units/${unit}/occurrences`, params: { id: unit }, as, body });
  if (res.status === 201) posted += 1;
  return res;
}

beforeAll(async () => {
  resetEnvCache();
  t9 = await unitId("T-9");
  bus14 = await unitId("Bus 14");
  const [c] = await getDb().select({ id: concerns.id }).from(concerns).where(and(eq(concerns.unitId, t9), eq(concerns.intermittent, true))).limit(1);
  t9Concern = c!.id;
});

afterAll(async () => {
  // Queued mail goes out within moments; let every message (a writer and a technician per entry) land first.
  for (let i = 0; i < 100; i += 1) {
    const [row] = await getDb().select({ n: count() }).from(mailOutbox).where(and(eq(mailOutbox.template, "occurrence-logged"), eq(mailOutbox.status, "sent")));
    if ((row?.n ?? 0) >= posted * 2) break;
    await new Promise((r) => setTimeout(r, 100));
  }
});

describe("POST /api/v1/units/:id/occurrences (api-v1.md)", () => {
  it("a township viewer logs an occurrence; it lands on the open intermittent concern, stored in °C", async () => {
    const body = { occurredAt: now(), hoursParked: 13, ambientF: 12, symptom: "no_start", batteryVolts: 11.8, recovered: false, note: "Jumped it." };
    const res = await postAs(FOREMAN, t9, body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ unitId: t9, concernId: t9Concern, hoursParked: 13, symptom: "no_start", batteryVolts: 11.8, recovered: false, note: "Jumped it.", canEdit: true });
    // NIST SP 811 App. B: t/°C = (t/°F − 32)/1.8 — 12 °F is −100/9 °C.
    expect(res.body.ambientC).toBe(celsiusFromFahrenheit(12));
    expect(res.body.ambientC).toBeCloseTo(-100 / 9, 12);
    expect(res.body.createdBy?.name).toBe((await userByEmail(FOREMAN)).name);
    const [row] = await getDb().select().from(occurrences).where(eq(occurrences.id, res.body.id));
    expect(row?.ambientC).toBeCloseTo(-100 / 9, 12);
    expect(row?.accountId).toBe((await userByEmail(FOREMAN)).accountId);
  });

  it("accepts exactly the contract's body (ambientC, no extras) from an approver and a clerk", async () => {
    for (const who of [SUPERVISOR, CLERK]) {
      const res = await postAs(who, t9, { occurredAt: now(), ambientC: -12.5, symptom: "slow_crank" });
      expect(res.status, who).toBe(201);
      expect(res.body).toMatchObject({ ambientC: -12.5, hoursParked: null, batteryVolts: null, recovered: null, note: "", symptomText: "" });
    }
  });

  it("e-mails the writer and the assigned technician through SMTP, linking straight to the concern", async () => {
    await smtp.clear();
    const res = await postAs(FOREMAN, t9, { occurredAt: now(), hoursParked: 15, ambientC: -9, symptom: "no_start", batteryVolts: 11.7, note: "Mail check" });
    expect(res.status).toBe(201);
    const toTech = await smtp.waitFor((m) => m.to.includes(TECH) && m.text.includes("Mail check"));
    const toWriter = await smtp.waitFor((m) => m.to.includes(WRITER) && m.text.includes("Mail check"));
    for (const m of [toTech, toWriter]) {
      expect(m.subject).toContain("T-9");
      expect(m.text).toContain(`http://localhost:3000/concerns/${t9Concern}`);
      expect(m.html).toContain(`/concerns/${t9Concern}`);
      expect(m.text).toContain("15 h");
      expect(m.text).toContain("11.7 V");
      // −9 °C is exactly 15.8 °F (F = C × 9/5 + 32).
      expect(m.text).toContain("15.8 °F");
    }
    // Only the shop hears about it; nobody at another account does.
    expect((await smtp.messages()).filter((m) => m.text.includes("Mail check")).flatMap((m) => m.to).sort()).toEqual([TECH, WRITER].sort());
  });

  it("refuses invalid values with 400 and a field error for each (api-v1.md: never a 500)", async () => {
    const base = { occurredAt: now(), symptom: "no_start" };
    const cases: [string, Record<string, unknown>, string][] = [
      ["temperature below −60 °C", { ambientC: -60.1 }, "ambientC"],
      ["temperature above 60 °C", { ambientC: 60.5 }, "ambientC"],
      ["temperature below −76 °F (−60 °C)", { ambientF: -77 }, "ambientF"],
      ["temperature above 140 °F (60 °C)", { ambientF: 141 }, "ambientF"],
      ["negative volts", { batteryVolts: -0.1 }, "batteryVolts"],
      ["volts above 30", { batteryVolts: 30.01 }, "batteryVolts"],
      ["time more than 5 minutes ahead", { occurredAt: minutesFromNow(6) }, "occurredAt"],
      ["negative hours parked", { hoursParked: -1 }, "hoursParked"],
      ["unknown symptom", { symptom: "exploded" }, "symptom"],
      ["number sent as text", { hoursParked: "12" }, "hoursParked"],
      ["not a time", { occurredAt: "yesterday" }, "occurredAt"],
      ["other without words", { symptom: "other" }, "symptomText"],
    ];
    const before = await getDb().select({ id: occurrences.id }).from(occurrences);
    for (const [what, change, path] of cases) {
      const res = await postAs(FOREMAN, t9, { ...base, ...change });
      expect(res.status, what).toBe(400);
      expect(res.headers.get("content-type"), what).toBe("application/problem+json");
      expect(res.body.code, what).toBe("invalid_input");
      expect(res.body.errors?.map((e) => e.path), what).toContain(path);
    }
    const missing = await postAs(FOREMAN, t9, {});
    expect(missing.status).toBe(400);
    expect(missing.body.errors?.map((e) => e.path).sort()).toEqual(["occurredAt", "symptom"]);
    const malformed = await call(post, { path: `/api/v1/units/${t9}/occurrences`, params: { id: t9 }, as: FOREMAN, body: "{not json" });
    expect(malformed.status).toBe(400);
    expect((await getDb().select({ id: occurrences.id }).from(occurrences)).length).toBe(before.length);
  });

  it("accepts the edges of each range: −60 °C, 60 °C, 0 V, 30 V, 0 h, and a clock 4 minutes ahead", async () => {
    for (const change of [{ ambientC: -60 }, { ambientC: 60 }, { batteryVolts: 0 }, { batteryVolts: 30 }, { hoursParked: 0 }, { occurredAt: minutesFromNow(4) }]) {
      const res = await postAs(FOREMAN, t9, { occurredAt: now(), symptom: "no_start", ...change });
      expect(res.status, JSON.stringify(change)).toBe(201);
    }
  });

  it("401 without a session; another account's unit is 404 for reading and writing, as if it did not exist", async () => {
    expect((await postAs(null, t9, { occurredAt: now(), symptom: "no_start" })).status).toBe(401);
    const before = await getDb().select({ id: occurrences.id }).from(occurrences).where(eq(occurrences.unitId, t9));
    const other = await postAs(BUS_OFFICE, t9, { occurredAt: now(), symptom: "no_start" });
    expect(other.status).toBe(404);
    expect(other.body.code).toBe("not_found");
    expect((await getDb().select({ id: occurrences.id }).from(occurrences).where(eq(occurrences.unitId, t9))).length).toBe(before.length);
    const read = await call<Problem>(list, { path: `/api/v1/units/${t9}/occurrences`, params: { id: t9 }, as: BUS_OFFICE });
    expect(read.status).toBe(404);
    const reverse = await call<Problem>(list, { path: `/api/v1/units/${bus14}/occurrences`, params: { id: bus14 }, as: FOREMAN });
    expect(reverse.status).toBe(404);
    expect((await call<Problem>(list, { path: "/api/v1/units/nope/occurrences", params: { id: "nope" }, as: FOREMAN })).status).toBe(404);
  });
});

describe("GET /api/v1/units/:id/occurrences", () => {
  it("lists the unit's log newest first with its concerns and what to record, paged by cursor", async () => {
    const res = await call<Log>(list, { path: `/api/v1/units/${t9}/occurrences?limit=200`, params: { id: t9 }, as: CLERK });
    expect(res.status).toBe(200);
    expect(res.body.occurrences.length).toBeGreaterThanOrEqual(15);
    const times = res.body.occurrences.map((o) => o.occurredAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(res.body.occurrences.every((o) => o.unitId === t9)).toBe(true);
    expect(res.body.concerns[0]).toMatchObject({ id: t9Concern, closedAt: null });
    expect(res.body.concerns[0]?.recordHint).toContain("outside temperature");

    const seen = new Set<string>();
    let cursor: string | null = "";
    while (cursor !== null) {
      const page: { body: Log } = await call<Log>(list, {
        path: `/api/v1/units/${t9}/occurrences?limit=4${cursor ? `&cursor=${cursor}` : ""}`,
        params: { id: t9 },
        as: CLERK,
      });
      for (const o of page.body.occurrences) {
        expect(seen.has(o.id)).toBe(false);
        seen.add(o.id);
      }
      cursor = page.body.nextCursor;
    }
    expect(seen.size).toBe(res.body.occurrences.length);
    for (const q of ["limit=0", "limit=201", "cursor=garbage"]) {
      expect((await call(list, { path: `/api/v1/units/${t9}/occurrences?${q}`, params: { id: t9 }, as: CLERK })).status, q).toBe(400);
    }
  });

  it("shop staff read any account's log; canEdit is true for them", async () => {
    const res = await call<Log>(list, { path: `/api/v1/units/${bus14}/occurrences`, params: { id: bus14 }, as: TECH });
    expect(res.status).toBe(200);
    expect(res.body.occurrences.length).toBe(4);
    expect(res.body.occurrences.every((o) => o.canEdit)).toBe(true);
    expect(res.body.concerns[0]?.complaint).toContain("ABS lamp");
  });
});

describe("PATCH /api/v1/units/:id/occurrences/:occurrenceId (author or shop only)", () => {
  it("the author corrects their own entry; another person of the same account may not (403); another account gets 404", async () => {
    const mine = await postAs(FOREMAN, t9, { occurredAt: now(), symptom: "no_start", ambientF: 20 });
    const path = `/api/v1/units/${t9}/occurrences/${mine.body.id}`;
    const params = { id: t9, occurrenceId: mine.body.id };

    const fixed = await call<Entry>(patch, { path, params, as: FOREMAN, method: "PATCH", body: { ambientF: 2, hoursParked: 12 } });
    expect(fixed.status).toBe(200);
    expect(fixed.body.ambientC).toBe(celsiusFromFahrenheit(2));
    expect(fixed.body.hoursParked).toBe(12);

    for (const who of [SUPERVISOR, CLERK]) {
      const res = await call<Problem>(patch, { path, params, as: who, method: "PATCH", body: { note: "not mine" } });
      expect(res.status, who).toBe(403);
      expect(res.body.code).toBe("forbidden");
      // They can still read it, and are told they cannot edit it.
      const seen = await call<Entry>(getOne, { path, params, as: who });
      expect(seen.body.canEdit).toBe(false);
    }
    expect((await call<Problem>(patch, { path, params, as: BUS_OFFICE, method: "PATCH", body: { note: "x" } })).status).toBe(404);

    const byShop = await call<Entry>(patch, { path, params, as: TECH, method: "PATCH", body: { note: "Confirmed with the driver." } });
    expect(byShop.status).toBe(200);
    expect(byShop.body.note).toBe("Confirmed with the driver.");

    const bad = await call<Problem>(patch, { path, params, as: FOREMAN, method: "PATCH", body: { batteryVolts: 31, hoursParked: -2 } });
    expect(bad.status).toBe(400);
    expect(bad.body.errors?.map((e) => e.path).sort()).toEqual(["batteryVolts", "hoursParked"]);
    expect((await call<Problem>(patch, { path, params, as: FOREMAN, method: "PATCH", body: {} })).status).toBe(400);
    expect((await call<Problem>(patch, { path, params, as: FOREMAN, method: "PATCH", body: { symptom: "other" } })).status).toBe(400);

    const [row] = await getDb().select().from(occurrences).where(eq(occurrences.id, mine.body.id));
    expect(row).toMatchObject({ note: "Confirmed with the driver.", hoursParked: 12, batteryVolts: null });
  });
});

describe("which concern an entry belongs to", () => {
  it("refuses a closed concern, and asks which one when a unit has two open", async () => {
    const busLog = await call<Log>(list, { path: `/api/v1/units/${bus14}/occurrences`, params: { id: bus14 }, as: BUS_OFFICE });
    const abs = busLog.body.concerns[0]!.id;
    const [second] = await getDb()
      .insert(concerns)
      .values({ unitId: bus14, complaint: "Rear door chime sounds with the door shut.", intermittent: true, recordHint: "Note whether it was raining." })
      .returning({ id: concerns.id });
    const ambiguous = await postAs(BUS_OFFICE, bus14, { occurredAt: now(), symptom: "warning_lamp" });
    expect(ambiguous.status).toBe(400);
    expect(ambiguous.body.errors?.[0]?.path).toBe("concernId");
    const named = await postAs(BUS_OFFICE, bus14, { occurredAt: now(), symptom: "warning_lamp", concernId: abs });
    expect(named.status).toBe(201);
    expect(named.body.concernId).toBe(abs);

    await getDb().update(concerns).set({ closedAt: now(), conclusion: "Chafed sensor lead." }).where(eq(concerns.id, second!.id));
    const closed = await postAs(BUS_OFFICE, bus14, { occurredAt: now(), symptom: "other", symptomText: "Chime", concernId: second!.id });
    expect(closed.status).toBe(400);
    expect(closed.body.errors?.[0]?.path).toBe("concernId");
    // Another unit's concern id is refused the same way.
    expect((await postAs(FOREMAN, t9, { occurredAt: now(), symptom: "no_start", concernId: abs })).status).toBe(400);
  });
});

describe("marking a concern intermittent and closing it (the shop's side)", () => {
  async function sessionUser(email: string) {
    const u = await userByEmail(email);
    return { id: u.id, name: u.name, email: u.email, role: u.role, accountId: u.accountId, signingLimitCents: u.signingLimitCents, via: "session" as const };
  }

  it("entries logged before any concern was open are adopted when the shop marks one; closing shows the fleet the conclusion", async () => {
    const t14 = await unitId("T-14");
    const early = await postAs(FOREMAN, t14, { occurredAt: now(), symptom: "drifted", note: "Plow down to the ground by morning." });
    expect(early.status).toBe(201);
    expect(early.body.concernId).toBeNull();

    const [plow] = await getDb().select({ id: concerns.id }).from(concerns).where(eq(concerns.unitId, t14)).orderBy(concerns.createdAt).limit(1);
    const writer = await sessionUser(WRITER);
    const marked = await markIntermittent(writer, plow!.id, "Note how long it sat and how far the plow dropped.");
    expect(marked.adopted).toBe(1);
    const [adopted] = await getDb().select().from(occurrences).where(eq(occurrences.id, early.body.id));
    expect(adopted?.concernId).toBe(plow!.id);

    // Scoped like everything else: a fleet user of another account cannot reach it.
    await expect(markIntermittent(await sessionUser(BUS_OFFICE), plow!.id, "x".repeat(20))).rejects.toMatchObject({ status: 404 });

    await closeConcern(await sessionUser(TECH), plow!.id, "Lift cylinder piston seals bypassing; resealed and held overnight with no drift.");
    const log = await call<Log>(list, { path: `/api/v1/units/${t14}/occurrences`, params: { id: t14 }, as: FOREMAN });
    const closed = log.body.concerns.find((c) => c.id === plow!.id);
    expect(closed?.closedAt).not.toBeNull();
    expect(closed?.conclusion).toContain("resealed");
    // Closed means closed: no more entries on it, and a second close is a conflict.
    expect((await postAs(FOREMAN, t14, { occurredAt: now(), symptom: "drifted", concernId: plow!.id })).status).toBe(400);
    await expect(closeConcern(writer, plow!.id, "Again, a second time.")).rejects.toMatchObject({ status: 409, code: "concern_closed" });
  });
});
