// Sign-in throttling (issue 9): failures count per account as well as per
// address, X-Forwarded-For counts only through COTTER_TRUSTED_PROXIES, and
// throttled attempts are in the audit log.
import { createServer } from "node:http";
import { and, desc, eq, like } from "drizzle-orm";
import { afterEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { auditLog, signInFailures } from "@/db/schema";
import { authOptions } from "@/lib/server/auth/options";
import { installSocketAddressStamp, SOCKET_ADDRESS_HEADER } from "@/lib/server/http/client-address";
import { resetEnvCache } from "@/lib/env";

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const authorize: Authorize = (c, req) => (authOptions().providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize(c, req);

/** A request as the server hands it on: the socket's address stamped, plus whatever the client claimed. */
const from = (socket: string, forwardedFor?: string) => ({
  headers: { [SOCKET_ADDRESS_HEADER]: socket, ...(forwardedFor ? { "x-forwarded-for": forwardedFor } : {}) },
});

async function failures(email: string, n: number, ip = "192.0.2.200") {
  const now = Date.now();
  await getDb()
    .insert(signInFailures)
    .values(Array.from({ length: n }, (_, i) => ({ ip: `${ip.slice(0, -1)}${i % 10}`, email, at: new Date(now - i * 20_000).toISOString() })));
}

afterEach(() => {
  delete process.env.COTTER_TRUSTED_PROXIES;
  resetEnvCache();
});

describe("sign-in", () => {
  it("signs in a demo user with the demo password and refuses a wrong one", async () => {
    const req = from("203.0.113.7");
    await expect(authorize({ email: "Supervisor@Brennan-Twp.example", password: "cotter-demo" }, req)).resolves.toMatchObject({ role: "approver" });
    await expect(authorize({ email: "supervisor@brennan-twp.example", password: "wrong" }, req)).resolves.toBeNull();
    await expect(authorize({ email: "nobody@brennan-twp.example", password: "cotter-demo" }, req)).resolves.toBeNull();
  });

  it("counts a failure against the socket's address, not a forged X-Forwarded-For", async () => {
    await authorize({ email: "clerk@brennan-twp.example", password: "wrong" }, from("198.51.100.77", "1.2.3.4"));
    const [row] = await getDb().select().from(signInFailures).where(eq(signInFailures.email, "clerk@brennan-twp.example")).orderBy(desc(signInFailures.at)).limit(1);
    expect(row?.ip).toBe("198.51.100.77");
  });

  it("with one trusted proxy, takes the address that proxy wrote, not the ones a client put before it", async () => {
    process.env.COTTER_TRUSTED_PROXIES = "1";
    resetEnvCache();
    await authorize({ email: "foreman@brennan-twp.example", password: "wrong" }, from("10.0.0.2", "1.2.3.4, 198.51.100.88"));
    const [row] = await getDb().select().from(signInFailures).where(eq(signInFailures.email, "foreman@brennan-twp.example")).orderBy(desc(signInFailures.at)).limit(1);
    expect(row?.ip).toBe("198.51.100.88");
  });

  it("locks an account after ten failures: the right password with a new forged address is refused, with the same answer from anywhere", async () => {
    await failures("trustee@brennan-twp.example", 10);
    const answers = await Promise.all(
      [from("203.0.113.50", "203.0.113.99"), from("203.0.113.51", "192.0.2.1"), from("203.0.113.52")].map((req) =>
        authorize({ email: "trustee@brennan-twp.example", password: "cotter-demo" }, req).then(
          () => "signed in",
          (e: Error) => e.message,
        ),
      ),
    );
    expect(new Set(answers).size).toBe(1);
    expect(answers[0]).toMatch(/^Too many failed sign-ins for this account\. Try again in \d+ minutes?/);
    const [audit] = await getDb().select().from(auditLog).where(eq(auditLog.action, "sign_in.locked_account")).orderBy(desc(auditLog.at)).limit(1);
    expect(audit?.detail).toMatchObject({ email: "trustee@brennan-twp.example", accountFailures: 10 });
  });

  it("slows one account down more with each failure, and records each slowed attempt", async () => {
    const email = "transport@alder-falls-schools.example";
    await failures(email, 3);
    const started = Date.now();
    await authorize({ email, password: "wrong" }, from("203.0.113.60"));
    expect(Date.now() - started).toBeGreaterThanOrEqual(1000);
    await authorize({ email, password: "wrong" }, from("203.0.113.61"));
    const rows = await getDb().select({ detail: auditLog.detail }).from(auditLog).where(and(eq(auditLog.action, "sign_in.delayed"), like(auditLog.detail, `%${email}%`)));
    expect(rows.map((r) => (r.detail as { delayMs: number }).delayMs)).toEqual([1000, 2000]);
  });

  it("locks an address trying many accounts, without touching the same people elsewhere", async () => {
    const ip = "198.51.100.23";
    const now = Date.now();
    await getDb()
      .insert(signInFailures)
      .values(Array.from({ length: 50 }, (_, i) => ({ ip, email: `guess${i}@example.com`, at: new Date(now - i * 10_000).toISOString() })));
    await expect(authorize({ email: "owner@quarry-road.example", password: "cotter-demo" }, from(ip))).rejects.toThrow(/Too many failed sign-ins from this network/);
    await expect(authorize({ email: "owner@quarry-road.example", password: "cotter-demo" }, from("198.51.100.24"))).resolves.toMatchObject({ role: "owner" });
  });
});

describe("the socket-address stamp", () => {
  it("replaces a client's own value with the socket's address", async () => {
    await installSocketAddressStamp();
    const seen = await new Promise<string | undefined>((resolve, reject) => {
      const server = createServer((req, res) => {
        res.end();
        server.close();
        resolve(req.headers[SOCKET_ADDRESS_HEADER] as string | undefined);
      });
      server.listen(0, "127.0.0.1", () => {
        const address = server.address();
        if (typeof address !== "object" || !address) return reject(new Error("no port"));
        fetch(`http://127.0.0.1:${address.port}/`, { headers: { [SOCKET_ADDRESS_HEADER]: "6.6.6.6" } }).catch(reject);
      });
    });
    expect(seen).toBe("127.0.0.1");
  });
});
