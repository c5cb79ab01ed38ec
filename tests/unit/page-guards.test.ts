import { describe, expect, it } from "vitest";
import { CAN } from "@/lib/auth/policy";
import { appRoutes, fillPattern, pageSource, paramKeys } from "@/tests/support/app-tree";

// Pages anyone may open: signing in (and asking for a reset link), the root that sends people to
// their home page, the one-time set-up (404 once anyone exists), and the pages an e-mailed
// single-use link opens (the token is the credential; a bad one is refused on the page).
const PUBLIC_PAGES = new Set(["/sign-in", "/", "/forgot-password", "/setup", "/invitation/[token]", "/reset-password/[token]"]);

/** The first thing the page awaits. */
function firstAwait(source: string): string | undefined {
  const body = source.slice(source.indexOf("export default"));
  return /await\s+([^;]+)/.exec(body)?.[1]?.trim();
}

describe("the app tree", () => {
  const routes = appRoutes();

  it("finds pages and route handlers with their URL patterns and methods", () => {
    const find = (pattern: string, kind: "page" | "api") => routes.find((r) => r.pattern === pattern && r.kind === kind);
    expect(find("/fleet/invoices/[id]", "page")?.group).toBe("fleet");
    expect(find("/work-orders/[id]", "page")?.group).toBe("shop");
    expect(find("/api/v1/invoices/[id]/checkout", "api")?.methods).toEqual(["POST"]);
    expect(find("/api/v1/units/[id]/occurrences", "api")?.methods.sort()).toEqual(["GET", "POST"]);
    // `export { handler as GET, handler as POST }`
    expect(find("/api/auth/[...nextauth]", "api")?.methods.sort()).toEqual(["GET", "POST"]);
  });

  it("every route handler exports at least one method", () => {
    expect(routes.filter((r) => r.kind === "api" && r.methods.length === 0).map((r) => r.file)).toEqual([]);
  });

  it("fills dynamic segments by the folder before them, and stops on one nobody mapped", () => {
    expect(paramKeys("/api/v1/units/[id]/occurrences/[occurrenceId]")).toEqual(["units/[id]", "occurrences/[occurrenceId]"]);
    expect(fillPattern("/units/[id]/log", { "units/[id]": "u1" }, "map.ts")).toBe("/units/u1/log");
    expect(() => fillPattern("/widgets/[widgetId]", {}, "map.ts")).toThrow(/"widgets\/\[widgetId\]".*map\.ts/);
  });
});

describe("every page guards itself before it reads anything", () => {
  const pages = appRoutes().filter((r) => r.kind === "page" && !PUBLIC_PAGES.has(r.pattern));

  it.each(pages.map((p) => [p.pattern, p.file] as const))("%s calls requirePageRole first", (_pattern, file) => {
    const source = pageSource(file);
    expect(firstAwait(source), `${file}: the first await must be requirePageRole(CAN.…)`).toMatch(/^requirePageRole\(CAN\.\w+\)/);
    // The old helpers check only that someone is signed in.
    expect(source).not.toMatch(/\b(requireUser|currentUser)\(/);
  });

  it("the public pages are the only ones without a guard", () => {
    const unguarded = appRoutes()
      .filter((r) => r.kind === "page")
      .filter((r) => !/requirePageRole\(/.test(pageSource(r.file)))
      .map((r) => r.pattern);
    expect(unguarded.sort()).toEqual([...PUBLIC_PAGES].sort());
  });

  // Next renders a page beside its layout: a shop page whose guard lets a fleet person through
  // would stream its content inside the shop layout's 403 (issue 9). So each page's own guard
  // names only the roles of its side of the app.
  const sides = { shop: CAN.shopStaff, fleet: CAN.fleet } as const;
  const sided = appRoutes().filter((r) => r.kind === "page" && (r.group === "shop" || r.group === "fleet") && !PUBLIC_PAGES.has(r.pattern));

  it.each(sided.map((p) => [p.pattern, p.group as keyof typeof sides, p.file] as const))("%s lets in only the %s side's roles", (_pattern, side, file) => {
    const key = /requirePageRole\(CAN\.(\w+)\)/.exec(pageSource(file))?.[1] as keyof typeof CAN;
    const outside = (CAN[key] as readonly string[]).filter((role) => !(sides[side] as readonly string[]).includes(role));
    expect(outside, `${file} guards with CAN.${key}`).toEqual([]);
  });
});
