/**
 * Part payments, the account statement with ageing on fixed dates (a test
 * clock), the CSV export and the shop's receivables, for an invented account
 * created here so every amount and date is known. Day counts follow the
 * Gregorian calendar; "today" is the shop's calendar day in America/Chicago
 * (UTC−5 in summer, IANA tz database). Buckets: api-v1.md.
 */
import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as exportCsv } from "@/app/api/v1/accounts/[id]/export/route";
import { GET as statement } from "@/app/api/v1/accounts/[id]/statement/route";
import { getDb, writeTx } from "@/db/client";
import { issueInvoice } from "@/db/queries/invoice-issue";
import { recordManualPayment } from "@/db/queries/payments";
import { receivables } from "@/db/queries/statement";
import { accounts, invoices, units, users, workOrders } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { HttpError } from "@/lib/http/problem";
import { CSV_COLUMNS } from "@/lib/invoices/csv";
import { queuePaymentReceived } from "@/lib/server/notifications/invoices";
import { call, sessionUser, userByEmail } from "./helpers/app";
import { asUser, setLines } from "./helpers/billing";
import { fileMailbox } from "./helpers/mail";

const smtp = fileMailbox();
let accountId = "";
const ids: Record<string, string> = {};

// Issue dates (noon in Chicago) and amounts; net 30.
const PLAN: [key: string, issuedOn: string, dollars: number][] = [
  ["a", "2026-06-10", 100], // due 07-10: not yet due
  ["b", "2026-05-31", 200], // due 06-30: due today, current
  ["g", "2026-05-15", 700], // due 06-14: 16 days
  ["c", "2026-05-02", 300], // due 06-01: 29 days, then paid in three parts
  ["e", "2026-04-01", 400], // due 05-01: 60 days
  ["d", "2026-03-02", 500], // due 04-01: 90 days
  ["f", "2026-01-30", 600], // due 03-01: 121 days, partly paid
];

async function refusal(p: Promise<unknown>): Promise<HttpError> {
  const error = await p.then(() => null, (e: unknown) => e);
  if (!(error instanceof HttpError)) throw new Error(`expected a refusal, got ${String(error)}`);
  return error;
}

beforeAll(async () => {
  resetEnvCache();
  const db = getDb();
  const clerk = await userByEmail("clerk@brennan-twp.example");
  const [account] = await db
    .insert(accounts)
    .values({ name: "Cedar Hollow Water District", billingEmail: "billing@cedar-hollow.example", taxExempt: true, taxExemptCertificate: "EX-CH-1", shopSuppliesExempt: true, paymentTermsDays: 30 })
    .returning({ id: accounts.id });
  accountId = account!.id;
  await db.insert(users).values([
    { email: "clerk@cedar-hollow.example", name: "Cedar Clerk", role: "clerk", accountId, passwordHash: clerk.passwordHash },
    { email: "viewer@cedar-hollow.example", name: "Cedar Viewer", role: "viewer", accountId, passwordHash: clerk.passwordHash },
  ]);
  const [unit] = await db.insert(units).values({ accountId, unitNumber: "CH-1", description: "Vacuum excavator truck" }).returning({ id: units.id });
  const writer = await asUser("writer@quarry-road.example");
  for (const [i, [key, issuedOn, dollars]] of PLAN.entries()) {
    const [wo] = await db
      .insert(workOrders)
      .values({ number: 9001 + i, unitId: unit!.id, accountId, status: "released", title: `Visit ${key}`, openedAt: `${issuedOn}T12:00:00.000Z`, releasedAt: `${issuedOn}T12:00:00.000Z` })
      .returning({ id: workOrders.id });
    await setLines(wo!.id, [{ kind: "part", description: `Part ${key}`, quantityMilli: 1000, unitPriceCents: dollars * 100 }]);
    // 17:00 UTC is noon in Chicago (CDT) or 11:00 (CST): the same calendar day either way.
    ids[key] = (await issueInvoice(writer, wo!.id, {}, new Date(`${issuedOn}T17:00:00.000Z`))).id;
  }
});
afterEach(() => {
  vi.useRealTimers();
});
afterAll(async () => {
});

describe("payments the shop records by hand", () => {
  it("part payments add up: partly paid, then paid; more than the balance is refused", async () => {
    const writer = await asUser("writer@quarry-road.example");
    const pay = (key: string, cents: number, at: string, method: "cheque" | "transfer" = "cheque") =>
      recordManualPayment(writer, ids[key]!, { method, amountCents: cents, reference: `Ref ${key} ${cents}`, receivedAt: at });
    const first = await pay("c", 10_000, "2026-06-05T15:00:00.000Z");
    expect(first).toMatchObject({ status: "open", balanceCents: 20_000 });
    // The receipt goes out straight after each payment (the server action sends it).
    const subject = `Receipt: $100.00 for invoice INV-${await numberOf("c")}`;
    const receipt = smtp.waitFor((m) => m.to.includes("clerk@cedar-hollow.example") && m.subject === subject);
    await writeTx((tx) => queuePaymentReceived(tx, first.paymentId));
    expect((await receipt).text).toContain("$200.00 is still open on this invoice.");
    expect((await pay("c", 5_000, "2026-06-20T15:00:00.000Z", "transfer")).balanceCents).toBe(15_000);
    expect((await refusal(pay("c", 15_001, "2026-06-25T15:00:00.000Z"))).detail).toBe("$150.01 is more than the open balance of $150.00.");
    expect(await pay("c", 15_000, "2026-06-25T15:00:00.000Z")).toMatchObject({ status: "paid", balanceCents: 0 });
    expect((await refusal(pay("c", 1, "2026-06-26T15:00:00.000Z"))).code).toBe("payment_refused");
    await pay("f", 20_000, "2026-04-10T15:00:00.000Z");
    await pay("f", 15_000, "2026-05-20T15:00:00.000Z", "transfer");
    const [f] = await getDb().select().from(invoices).where(eq(invoices.id, ids.f!));
    expect(f).toMatchObject({ status: "open", paidCents: 35_000 });
  });
});

async function numberOf(key: string): Promise<number> {
  const [inv] = await getDb().select({ n: invoices.number }).from(invoices).where(eq(invoices.id, ids[key]!));
  return inv!.n;
}

type Statement = {
  accountId: string;
  asOf: string;
  totalDueCents: number;
  ageing: Record<string, number>;
  invoices: { id: string; daysPastDue: number; bucket: string; balanceCents: number }[];
  payments: { amountCents: number }[];
  paymentsInPeriodCents: number;
};

async function statementAt(instant: string, as = "clerk@cedar-hollow.example") {
  vi.useFakeTimers({ toFake: ["Date"] });
  vi.setSystemTime(new Date(instant));
  return call<Statement>(statement, { path: `/api/v1/accounts/${accountId}/statement`, params: { id: accountId }, as });
}

describe("the account statement (GET /api/v1/accounts/:id/statement)", () => {
  it("ages open balances in the five buckets on a fixed date", async () => {
    // 2026-07-01 03:00 UTC is still June 30 in Chicago.
    const res = await statementAt("2026-07-01T03:00:00.000Z");
    expect(res.status).toBe(200);
    expect(res.body.asOf).toBe("2026-06-30");
    expect(res.body.ageing).toEqual({ current: 30_000, days1to30: 70_000, days31to60: 40_000, days61to90: 50_000, over90: 25_000 });
    expect(res.body.totalDueCents).toBe(215_000);
    const days = Object.fromEntries(res.body.invoices.map((i) => [i.id, [i.daysPastDue, i.bucket]]));
    expect(days[ids.a!]).toEqual([-10, "current"]);
    expect(days[ids.b!]).toEqual([0, "current"]);
    expect(days[ids.g!]).toEqual([16, "days1to30"]);
    expect(days[ids.e!]).toEqual([60, "days31to60"]);
    expect(days[ids.d!]).toEqual([90, "days61to90"]);
    expect(days[ids.f!]).toEqual([121, "over90"]);
    expect(days[ids.c!]).toBeUndefined();
    // Payments in the last 30 days (06-01 … 06-30): $100 + $50 + $150.
    expect(res.body.paymentsInPeriodCents).toBe(30_000);
    expect(res.body.payments).toHaveLength(3);
  });

  it("moves an invoice to the next bucket when the shop's day turns", async () => {
    // 06:00 UTC on July 1 is 01:00 in Chicago: invoice b is now one day past due.
    const res = await statementAt("2026-07-01T06:00:00.000Z");
    expect(res.body.asOf).toBe("2026-07-01");
    expect(res.body.ageing).toMatchObject({ current: 10_000, days1to30: 90_000 });
    // e (61 days) moves to 61–90 and d (91 days) to over 90.
    expect(res.body.ageing).toMatchObject({ days31to60: 0, days61to90: 40_000, over90: 75_000 });
  });

  it("the shop's receivables show the same ageing for the account", async () => {
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(new Date("2026-07-01T03:00:00.000Z"));
    const r = await receivables(await sessionUser("writer@quarry-road.example"));
    const mine = r.accounts.find((a) => a.accountId === accountId);
    expect(mine?.ageing).toEqual({ current: 30_000, days1to30: 70_000, days31to60: 40_000, days61to90: 50_000, over90: 25_000 });
    const sum = r.accounts.reduce((s, a) => s + a.totalDueCents, 0);
    expect(r.totalDueCents).toBe(sum);
  });

  it("clerks and the shop may read it; a viewer gets 403, another account 404, a technician 403", async () => {
    expect((await statementAt("2026-07-01T03:00:00.000Z", "owner@quarry-road.example")).status).toBe(200);
    expect((await statementAt("2026-07-01T03:00:00.000Z", "viewer@cedar-hollow.example")).status).toBe(403);
    expect((await statementAt("2026-07-01T03:00:00.000Z", "clerk@brennan-twp.example")).status).toBe(404);
    expect((await statementAt("2026-07-01T03:00:00.000Z", "tech@quarry-road.example")).status).toBe(403);
    const township = (await userByEmail("clerk@brennan-twp.example")).accountId!;
    const cross = await call(statement, { path: "/x", params: { id: township }, as: "clerk@cedar-hollow.example" });
    expect(cross.status).toBe(404);
    const bad = await call(statement, { path: "/x?from=2026-13-01", params: { id: accountId }, as: "clerk@cedar-hollow.example" });
    expect(bad.status).toBe(400);
  });
});

describe("CSV export for the fleet's accounting (README, CSV export)", () => {
  it("lists invoices issued and payments received in the range, one per row, RFC 4180", async () => {
    const res = await call<string>(exportCsv, {
      path: `/api/v1/accounts/${accountId}/export?from=2026-05-01&to=2026-06-30`,
      params: { id: accountId },
      as: "clerk@cedar-hollow.example",
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(res.headers.get("content-disposition")).toContain("invoices-payments-2026-05-01-to-2026-06-30.csv");
    const lines = res.body.split("\r\n").filter(Boolean);
    expect(lines[0]).toBe(CSV_COLUMNS.join(","));
    const rows = lines.slice(1).map((l) => l.split(","));
    // Invoices a, b, g, c issued in May–June; payments on c (3) and f (05-20).
    expect(rows.filter((r) => r[0] === "invoice").map((r) => r[1])).toEqual(["2026-05-02", "2026-05-15", "2026-05-31", "2026-06-10"]);
    expect(rows.filter((r) => r[0] === "payment").map((r) => r[18])).toEqual(["150.00", "100.00", "50.00", "150.00"]);
    const c = rows.find((r) => r[0] === "invoice" && r[1] === "2026-05-02");
    expect(c).toEqual(["invoice", "2026-05-02", `INV-${await numberOf("c")}`, "W-9004", "CH-1", "", "paid", "2026-06-01", "0.00", "300.00", "0.00", "0.00", "0.00", "0.00", "0.00", "300.00", "", "", "", "0.00"]);
    const other = await call(exportCsv, { path: "/x?from=2026-05-01&to=2026-06-30", params: { id: accountId }, as: "clerk@brennan-twp.example" });
    expect(other.status).toBe(404);
    const backwards = await call(exportCsv, { path: "/x?from=2026-06-30&to=2026-05-01", params: { id: accountId }, as: "clerk@cedar-hollow.example" });
    expect(backwards.status).toBe(400);
  });
});
