// A not-found page per part of the app (issue 12, item 5): a missing record is a
// real 404 inside the frame of the part it was asked for, with a way back home.
import { eq } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { afterAll, describe, expect, inject, it } from "vitest";
import { openDatabase } from "@/db/client";
import { users } from "@/db/schema";

const handle = openDatabase(inject("dbUrl"));
afterAll(() => handle.client.close());

async function cookieFor(email: string): Promise<string> {
  const [u] = await handle.db.select().from(users).where(eq(users.email, email)).limit(1);
  return `next-auth.session-token=${await encode({ token: { sub: u!.id, name: u!.name, email: u!.email }, secret: inject("authSecret") })}`;
}

async function get(path: string, email?: string): Promise<{ status: number; html: string }> {
  const res = await fetch(`${inject("baseUrl")}${path}`, { headers: email ? { cookie: await cookieFor(email) } : {} });
  return { status: res.status, html: await res.text() };
}

const MISSING = "00000000-0000-4000-8000-000000000000";

describe("not found", () => {
  it("in the shop: 404 inside the shop's frame, back to the Floor", async () => {
    const { status, html } = await get(`/work-orders/${MISSING}`, "writer@quarry-road.example");
    expect(status).toBe(404);
    expect(html).toContain("Back to the Floor");
    // The shop's navigation is around it (in the HTML, or in the page data Next renders it from).
    expect(html).toMatch(/aria-label(="|\\":\\")Main/);
  });

  it("in the fleet portal: 404 inside the portal's frame, back to the account's units", async () => {
    const { status, html } = await get(`/fleet/work-orders/${MISSING}`, "supervisor@brennan-twp.example");
    expect(status).toBe(404);
    expect(html).toContain("Back to your units");
  });

  it("a set-up page once the shop is set up: 404 that sends people to sign in", async () => {
    const { status, html } = await get("/setup");
    expect(status).toBe(404);
    expect(html).toContain("Go to sign-in");
  });

  it("an address that is no page at all: the app-wide 404", async () => {
    const { status, html } = await get("/no-such-page");
    expect(status).toBe(404);
    expect(html).toContain("Go to your home page");
  });
});
