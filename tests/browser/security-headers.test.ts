// Security headers from proxy.ts on every response (issue 9), a malformed URL
// answered as a problem document, and photos served as what they are.
import { eq } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { afterAll, describe, expect, it } from "vitest";
import { inject } from "vitest";
import { openDatabase } from "@/db/client";
import { photos, users } from "@/db/schema";

const handle = openDatabase(inject("dbUrl"));
afterAll(() => handle.client.close());

async function cookieFor(email: string): Promise<string> {
  const [u] = await handle.db.select().from(users).where(eq(users.email, email)).limit(1);
  return `next-auth.session-token=${await encode({ token: { sub: u!.id, name: u!.name, email: u!.email }, secret: inject("authSecret") })}`;
}

function expectSecurityHeaders(h: Headers) {
  const csp = h.get("content-security-policy") ?? "";
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(h.get("x-frame-options")).toBe("DENY");
  expect(h.get("x-content-type-options")).toBe("nosniff");
  expect(h.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  expect(h.get("permissions-policy")).toContain("camera=(self)");
  // Served over plain http here, so no HSTS (it is sent when NEXTAUTH_URL is https).
  expect(h.get("strict-transport-security")).toBeNull();
}

describe("security headers", () => {
  it("on a page, a refused page and an API route", async () => {
    const base = inject("baseUrl");
    expectSecurityHeaders((await fetch(`${base}/sign-in`)).headers);
    expectSecurityHeaders((await fetch(`${base}/floor`, { headers: { cookie: await cookieFor("office@kettle-ridge.example") } })).headers);
    expectSecurityHeaders((await fetch(`${base}/api/v1/health`)).headers);
    expectSecurityHeaders((await fetch(`${base}/api/v1/me`)).headers);
  });

  it("a path with malformed percent-encoding is a 400 problem document, not a 500", async () => {
    for (const path of ["/api/v1/units/%E0%A4%A", "/fleet/units/%E0%A4%A", "/api/v1/units/%ZZ"]) {
      const res = await fetch(`${inject("baseUrl")}${path}`, { headers: { cookie: await cookieFor("office@kettle-ridge.example") } });
      expect(res.status).toBe(400);
      expect(res.headers.get("content-type")).toBe("application/problem+json");
      expect(await res.json()).toMatchObject({ status: 400, code: "malformed_url" });
      expectSecurityHeaders(res.headers);
    }
  });

  it("serves a photo as a JPEG image, never sniffed", async () => {
    const [photo] = await handle.db.select({ id: photos.id }).from(photos).limit(1);
    for (const suffix of ["", "/thumb"]) {
      const res = await fetch(`${inject("baseUrl")}/api/v1/photos/${photo!.id}${suffix}`, { headers: { cookie: await cookieFor("owner@quarry-road.example") } });
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toBe("image/jpeg");
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      const bytes = new Uint8Array(await res.arrayBuffer());
      // JPEG files start with the SOI marker FF D8 FF (ITU-T T.81, annex B).
      expect([...bytes.slice(0, 3)]).toEqual([0xff, 0xd8, 0xff]);
    }
  });
});
