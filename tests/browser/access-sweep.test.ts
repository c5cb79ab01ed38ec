// Every page and every API route, found from the app/ tree, asked for the
// first account's records by another account's approver, clerk and viewer and
// by nobody: each must refuse with a real status and show none of the first
// account's names, numbers or addresses (issue 9). Plain HTTP, no browser.
import { count, eq } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inject } from "vitest";
import { openDatabase } from "@/db/client";
import { CAN } from "@/lib/auth/policy";
import { SHOP_ROLES } from "@/lib/domain";
import { auditLog, checkoutSessions, decisions, estimateLines, findings, mailOutbox, meterReadings, occurrences, payments, photos, statusEvents, users } from "@/db/schema";
import { appRoutes, fillPattern, pageSource, type AppRoute } from "@/tests/support/app-tree";
import { accountIdOf, findLeak, idsOf, leakStrings, PARAM_MAP_FILE, paramValues, personasOf, removeSweepPeople, type Persona } from "./sweep/fixture";

const FIRST = "Brennan Township Highway Department";
const SECOND = "Kettle Ridge Stone Co.";

// Open to anyone by design; they are still swept, and must not leak or fail.
const PUBLIC = new Set([
  "/sign-in",
  "/",
  "/api/v1/health",
  "/api/v1/openapi.json",
  "/api/auth/[...nextauth]",
  "/api/uploadthing",
  "/api/webhooks/stripe",
  // First run (gone once anyone exists) and the pages and routes an e-mailed single-use link opens.
  "/setup",
  "/api/v1/setup",
  "/forgot-password",
  "/api/v1/password-resets",
  "/api/v1/password-resets/complete",
  "/invitation/[token]",
  "/reset-password/[token]",
  "/api/v1/invitations/accept",
]);

// Query strings a GET needs before it looks anything up; without one the answer is 400, which proves nothing about scope.
const QUERY: Record<string, string> = {
  "/api/v1/accounts/[id]/export": "?from=2020-01-01&to=2035-12-31",
};

const handle = openDatabase(inject("dbUrl"));
const db = handle.db;
const tables = { auditLog, decisions, estimateLines, findings, mailOutbox, meterReadings, occurrences, payments, photos, statusEvents, checkoutSessions };

async function fingerprint(): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const [name, table] of Object.entries(tables)) {
    const [row] = await db.select({ n: count() }).from(table);
    out[name] = row?.n ?? 0;
  }
  return out;
}

/** The statuses a refusal may have: a record is another account's (404) or the role may not (403); nobody is 401. */
function allowed(route: AppRoute, method: string, persona: Persona): number[] {
  if (PUBLIC.has(route.pattern)) return [];
  if (persona.role === null) return [401];
  const dynamic = route.pattern.includes("[");
  if (method === "GET") return dynamic ? [403, 404] : [200, 403];
  // A write with an empty body may be turned away as bad input before anything is looked up.
  return [400, 403, 404, 405, 415];
}

let leaks: string[] = [];
let values: Record<string, string> = {};
let personas: Persona[] = [];
let before: Record<string, number> = {};

beforeAll(async () => {
  await removeSweepPeople(db);
  const [first, second] = await Promise.all([idsOf(db, FIRST), accountIdOf(db, SECOND)]);
  values = paramValues(first);
  leaks = await leakStrings(db, first.accountId, second);
  personas = await personasOf(db, second, inject("authSecret"));
  before = await fingerprint();
});

afterAll(async () => {
  await removeSweepPeople(db);
  handle.client.close();
});

const routes = appRoutes();

async function staffCookie(role: (typeof SHOP_ROLES)[number]): Promise<string> {
  const [u] = await db.select().from(users).where(eq(users.role, role)).limit(1);
  if (!u) throw new Error(`no demo ${role}`);
  return `next-auth.session-token=${await encode({ token: { sub: u.id, name: u.name, email: u.email }, secret: inject("authSecret") })}`;
}

describe("access sweep over every page and API route", () => {
  it("has something to sweep and strings to look for", () => {
    expect(routes.filter((r) => r.kind === "page").length).toBeGreaterThan(20);
    expect(routes.filter((r) => r.kind === "api").length).toBeGreaterThan(20);
    expect(leaks).toEqual(expect.arrayContaining([FIRST, "supervisor@brennan-twp.example", "EX-BT-20417"]));
  });

  it.each(routes.map((r) => [r.kind, r.pattern, r] as const))("%s %s", async (_kind, _pattern, route) => {
    const url = `${inject("baseUrl")}${fillPattern(route.pattern, values, PARAM_MAP_FILE)}${QUERY[route.pattern] ?? ""}`;
    const failures: string[] = [];
    for (const persona of personas) {
      for (const method of route.methods.filter((m) => m !== "HEAD" && m !== "OPTIONS")) {
        const headers: Record<string, string> = {};
        if (persona.cookie) headers.cookie = persona.cookie;
        const write = method !== "GET";
        if (write) headers["content-type"] = "application/json";
        const res = await fetch(url, { method, headers, body: write ? "{}" : undefined, redirect: "manual" });
        const body = await res.text();
        const what = `${method} ${url} as ${persona.label}: ${res.status}`;
        const expected = allowed(route, method, persona);
        if (res.status >= 500) failures.push(`${what} (a server error)`);
        else if (expected.length && !expected.includes(res.status)) {
          const hint = method === "GET" && res.status === 400 ? ` (if it needs query parameters, add them to QUERY in this file)` : "";
          failures.push(`${what}, expected ${expected.join(" or ")}${hint}`);
        }
        const leak = findLeak(body, leaks);
        if (leak) failures.push(`${what} shows "${leak}" of ${FIRST}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it("every page refuses, with 403, the shop roles its guard leaves out", async () => {
    const failures: string[] = [];
    for (const route of routes.filter((r) => r.kind === "page" && r.group === "shop")) {
      const key = /requirePageRole\(CAN\.(\w+)\)/.exec(pageSource(route.file))?.[1] as keyof typeof CAN | undefined;
      if (!key) continue;
      for (const role of SHOP_ROLES.filter((r) => !(CAN[key] as readonly string[]).includes(r))) {
        const url = `${inject("baseUrl")}${fillPattern(route.pattern, values, PARAM_MAP_FILE)}`;
        const res = await fetch(url, { headers: { cookie: await staffCookie(role) }, redirect: "manual" });
        if (res.status !== 403) failures.push(`GET ${route.pattern} as ${role}: ${res.status}, expected 403`);
      }
    }
    expect(failures).toEqual([]);
  });

  it("the API reference refuses before it renders: nobody 401, a fleet person on the shop's page 403, with nothing of the reference in the body", async () => {
    // Words only the reference shows (an operation id, a schema name, a path template).
    const marks = ["decideLine", "LineDecisionResult", "/api/v1/lines/{id}/decision"];
    const read = async (path: string, cookie: string | null) => {
      const res = await fetch(`${inject("baseUrl")}${path}`, { headers: cookie ? { cookie } : {}, redirect: "manual" });
      const body = await res.text();
      return { status: res.status, shows: marks.filter((m) => body.includes(m)) };
    };
    const fleet = personas.find((p) => p.role === "approver")!;
    expect(await read("/settings/tokens/reference", null)).toEqual({ status: 401, shows: [] });
    expect(await read("/fleet/settings/tokens/reference", null)).toEqual({ status: 401, shows: [] });
    expect(await read("/settings/tokens/reference", fleet.cookie)).toEqual({ status: 403, shows: [] });
    // and the people it is for do get it
    expect(await read("/fleet/settings/tokens/reference", fleet.cookie)).toEqual({ status: 200, shows: marks });
    expect(await read("/settings/tokens/reference", await staffCookie("writer"))).toEqual({ status: 200, shows: marks });
  });

  it("changed nothing in the first account's data", async () => {
    expect(await fingerprint()).toEqual(before);
  });
});
