import { and, count, desc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as getOne, PATCH as patch } from "@/app/api/v1/accounts/[id]/route";
import { GET as list, POST as create } from "@/app/api/v1/accounts/route";
import { getDb } from "@/db/client";
import { accountContacts, accounts, auditLog } from "@/db/schema";
import { describeChange } from "@/lib/audit-format";
import { call } from "./helpers/app";

const OWNER = "owner@quarry-road.example";
const WRITER = "writer@quarry-road.example";
const FLEET = ["supervisor@brennan-twp.example", "clerk@brennan-twp.example", "foreman@brennan-twp.example"];

type AccountBody = {
  id: string;
  name: string;
  overrunPercent: number;
  overrunFloorCents: number;
  overrunCapCents: number | null;
  budgetCents: number | null;
  budgetRemainingCents: number | null;
  contacts: { name: string; role: string; email: string; billing: boolean }[];
  archived: boolean;
};

async function accountCount() {
  const [row] = await getDb().select({ n: count() }).from(accounts);
  return row!.n;
}

async function idOf(name: string) {
  const [a] = await getDb().select({ id: accounts.id }).from(accounts).where(eq(accounts.name, name));
  return a!.id;
}

const newAccount = {
  name: "Cedar Hollow Sanitation District",
  billingEmail: "AP@cedar-hollow.example",
  address: "9 Pump House Road\nCedar Hollow",
  phone: "(555) 010-7781",
  taxExempt: true,
  taxExemptCertificate: "EX-55-0193",
  poRequired: true,
  termsDays: 45,
  fiscalYearStartMonth: 7,
  budgetCents: 8_000_000,
  standingAuthorisationCents: 25_000,
  contacts: [{ name: "Ines Barros", role: "Fleet manager", email: "ines@cedar-hollow.example", phone: "(555) 010-7782", billing: false }],
};

describe("fleet accounts through the API", () => {
  it("a writer creates an account: 201, the Florida overrun shape by default, contacts kept", async () => {
    const res = await call<AccountBody>(create, { path: "/api/v1/accounts", as: WRITER, body: newAccount });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: newAccount.name, budgetCents: 8_000_000, budgetRemainingCents: 8_000_000, archived: false });
    // reference-values.md: the default for a new account is the Florida shape, $10 or 10 %, the greater, at most $50.
    expect(res.body).toMatchObject({ overrunPercent: 10, overrunFloorCents: 1_000, overrunCapCents: 5_000 });
    expect(res.body.contacts).toEqual([expect.objectContaining({ name: "Ines Barros", role: "Fleet manager" })]);
    const [audit] = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, res.body.id), eq(auditLog.action, "account.created")));
    expect(describeChange(audit!.detail)).toContain("Repair budget: $80,000.00");
  });

  it("only the owner and writers create or change accounts; nobody signed out does anything", async () => {
    const before = await accountCount();
    for (const who of ["tech@quarry-road.example", ...FLEET]) {
      expect((await call(create, { path: "/api/v1/accounts", as: who, body: { ...newAccount, name: `X ${who}` } })).status, who).toBe(403);
    }
    expect((await call(create, { path: "/api/v1/accounts", body: newAccount })).status).toBe(401);
    const brennan = await idOf("Brennan Township Highway Department");
    expect((await call(patch, { path: `/api/v1/accounts/${brennan}`, as: "supervisor@brennan-twp.example", method: "PATCH", params: { id: brennan }, body: { budgetCents: 1 } })).status).toBe(403);
    expect(await accountCount()).toBe(before);
  });

  it("bad input is a 400 naming the field, and nothing is written", async () => {
    const before = await accountCount();
    const cases: [Record<string, unknown>, string][] = [
      [{ ...newAccount, name: "" }, "name"],
      [{ ...newAccount, name: "Y1", billingEmail: "nope" }, "billingEmail"],
      [{ ...newAccount, name: "Y2", taxExemptCertificate: null }, "taxExemptCertificate"],
      [{ ...newAccount, name: "Y3", termsDays: -1 }, "termsDays"],
      [{ ...newAccount, name: "Y4", fiscalYearStartMonth: 13 }, "fiscalYearStartMonth"],
      [{ ...newAccount, name: "Y5", overrunFloorCents: 9_000, overrunCapCents: 5_000 }, "overrunFloorCents"],
      [{ ...newAccount, name: "Y6", budgetCents: 12.5 }, "budgetCents"],
      [{ ...newAccount, name: "Y7", taxExempt: false, taxRatePct: 6.6255 }, "taxRatePct"],
      [{ ...newAccount, name: "Y8", contacts: [{ name: "", email: "x" }] }, "contacts.0.name"],
      [{ ...newAccount, name: "Kettle Ridge Stone Co." }, "name"],
    ];
    for (const [body, field] of cases) {
      const res = await call(create, { path: "/api/v1/accounts", as: OWNER, body });
      expect(res.status, field).toBe(400);
      expect(res.body.errors?.map((e) => e.path), field).toContain(field);
    }
    expect(await accountCount()).toBe(before);
  });

  it("the shop lists every account; a fleet person sees only their own, and another's id is 404", async () => {
    const shop = await call<{ accounts: AccountBody[]; nextCursor: string | null }>(list, { path: "/api/v1/accounts?limit=2", as: OWNER });
    expect(shop.status).toBe(200);
    expect(shop.body.accounts).toHaveLength(2);
    expect(shop.body.nextCursor).not.toBeNull();
    const next = await call<{ accounts: AccountBody[] }>(list, { path: `/api/v1/accounts?limit=200&cursor=${shop.body.nextCursor}`, as: OWNER });
    expect(next.body.accounts.map((a) => a.name)).not.toContain(shop.body.accounts[0]!.name);

    const kettle = await idOf("Kettle Ridge Stone Co.");
    const brennan = await idOf("Brennan Township Highway Department");
    for (const who of FLEET) {
      const mine = await call<{ accounts: AccountBody[] }>(list, { path: "/api/v1/accounts", as: who });
      expect(mine.body.accounts.map((a) => a.name)).toEqual(["Brennan Township Highway Department"]);
      expect((await call(getOne, { path: `/api/v1/accounts/${kettle}`, as: who, params: { id: kettle } })).status).toBe(404);
      expect((await call(getOne, { path: `/api/v1/accounts/${brennan}`, as: who, params: { id: brennan } })).status).toBe(200);
    }
    expect((await call(getOne, { path: "/api/v1/accounts/nope", as: OWNER, params: { id: "nope" } })).status).toBe(404);
  });

  it("PATCH changes fields and contacts, each audited with its old and new value in words; a bad merge changes nothing", async () => {
    const kettle = await idOf("Kettle Ridge Stone Co.");
    const res = await call<AccountBody & { changed: number }>(patch, {
      path: `/api/v1/accounts/${kettle}`,
      as: WRITER,
      method: "PATCH",
      params: { id: kettle },
      body: { termsDays: 15, phone: "(555) 010-9000", contacts: [{ name: "Gus Ferrante", role: "Quarry foreman", billing: true, email: "gus@kettle-ridge.example" }] },
    });
    expect(res.status).toBe(200);
    expect(res.body.changed).toBe(3);
    const [audit] = await getDb().select().from(auditLog).where(eq(auditLog.entityId, kettle)).orderBy(desc(auditLog.at)).limit(1);
    const words = describeChange(audit!.detail);
    expect(words).toContain("Payment terms (days): 30 → 15");
    expect(words.find((w) => w.startsWith("Contacts:"))).toContain("Gus Ferrante (Quarry foreman) gus@kettle-ridge.example billing");
    expect(await getDb().select().from(accountContacts).where(eq(accountContacts.accountId, kettle))).toHaveLength(1);

    const [before] = await getDb().select().from(accounts).where(eq(accounts.id, kettle));
    const bad = await call(patch, { path: `/api/v1/accounts/${kettle}`, as: WRITER, method: "PATCH", params: { id: kettle }, body: { overrunFloorCents: 99_999 } });
    expect(bad.status).toBe(400);
    expect(bad.body.errors?.[0]?.path).toBe("overrunFloorCents");
    const unknown = await call(patch, { path: `/api/v1/accounts/${kettle}`, as: WRITER, method: "PATCH", params: { id: kettle }, body: { colour: "red" } });
    expect(unknown.status).toBe(400);
    const [after] = await getDb().select().from(accounts).where(eq(accounts.id, kettle));
    expect(after).toEqual(before);
    expect((await call(patch, { path: "/api/v1/accounts/nope", as: WRITER, method: "PATCH", params: { id: "nope" }, body: { termsDays: 10 } })).status).toBe(404);
  });

  it("an archived account leaves the list, is still readable, and comes back", async () => {
    const id = await idOf("Cedar Hollow Sanitation District");
    const res = await call<AccountBody>(patch, { path: `/api/v1/accounts/${id}`, as: OWNER, method: "PATCH", params: { id }, body: { archived: true } });
    expect(res.body.archived).toBe(true);
    const listed = await call<{ accounts: AccountBody[] }>(list, { path: "/api/v1/accounts?limit=200", as: OWNER });
    expect(listed.body.accounts.map((a) => a.id)).not.toContain(id);
    const all = await call<{ accounts: AccountBody[] }>(list, { path: "/api/v1/accounts?limit=200&archived=true", as: OWNER });
    expect(all.body.accounts.map((a) => a.id)).toContain(id);
    const [audit] = await getDb().select().from(auditLog).where(eq(auditLog.entityId, id)).orderBy(desc(auditLog.at)).limit(1);
    expect(describeChange(audit!.detail)).toEqual(["Archived: no → yes"]);
    await call(patch, { path: `/api/v1/accounts/${id}`, as: OWNER, method: "PATCH", params: { id }, body: { archived: false } });
  });
});
