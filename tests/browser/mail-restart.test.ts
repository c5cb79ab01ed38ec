// Mail survives the mail server being away and the app restarting (issue 9):
// a real `next start` queues the e-mail with the change, cannot reach the mail
// server, is stopped; the mail server comes back; a new `next start` on the
// same database delivers each message exactly once.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openDatabase } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";
import { mailOutbox, users, workOrders } from "@/db/schema";
import { startFakeSmtp, type FakeSmtp } from "@/mocks/smtp/server";
import { freePort } from "@/tests/support/ports";
import { startNextServer, type NextServer } from "@/tests/support/next-server";

/** `next start` of the test build with exactly the environment given (plus PATH and HOME). */
const startApp = (env: Record<string, string>): Promise<NextServer> => startNextServer({ distDir: inject("distDir"), env, inheritEnv: false });

const SECRET = "mail-restart-tests-secret-mail-restart";
const dir = mkdtempSync(path.join(tmpdir(), "cotter-mail-restart-"));
const dbUrl = `file:${path.join(dir, "cotter.db")}`;
let handle: ReturnType<typeof openDatabase>;
let smtp: FakeSmtp | null = null;
let app: NextServer | null = null;

beforeAll(async () => {
  await migrateDatabase(dbUrl);
  await seedDatabase(dbUrl, { photos: false });
  handle = openDatabase(dbUrl);
}, 120_000);

afterAll(async () => {
  await app?.stop();
  await smtp?.close();
  handle?.client.close();
  rmSync(dir, { recursive: true, force: true });
});

async function until<T>(probe: () => Promise<T | null | undefined | false>, what: string, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const value = await probe();
    if (value) return value;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`timed out waiting for ${what}`);
}

describe("queued mail across a mail-server outage and an app restart", () => {
  it("is delivered once to each person when both are back", async () => {
    const smtpPort = await freePort();
    const env = { DATABASE_URL: dbUrl, COTTER_DEMO: "1", NEXTAUTH_SECRET: SECRET, SMTP_URL: `smtp://127.0.0.1:${smtpPort}` };
    app = await startApp(env);
    expect(await app.ready()).toBe("running");

    // The writer marks a unit ready for pickup: the account's approvers and viewers are e-mailed.
    const [writer] = await handle.db.select().from(users).where(eq(users.email, "writer@quarry-road.example"));
    const [wo] = await handle.db.select().from(workOrders).where(eq(workOrders.number, 1046));
    const cookie = `next-auth.session-token=${await encode({ token: { sub: writer!.id, name: writer!.name, email: writer!.email }, secret: SECRET })}`;
    const moved = await fetch(`${app.url}/api/v1/work-orders/${wo!.id}/status`, {
      method: "POST",
      headers: { cookie, "content-type": "application/json" },
      body: JSON.stringify({ status: "ready", note: "Parked by the gate." }),
    });
    expect(moved.status).toBe(200);
    const readyMail = and(eq(mailOutbox.template, "unit-ready"));
    // The mail server is not there: every message is tried once and kept.
    const tried = await until(async () => {
      const rows = await handle.db.select().from(mailOutbox).where(readyMail);
      return rows.length > 0 && rows.every((r) => r.attempts >= 1 && r.status === "queued") && rows;
    }, "a failed first attempt");
    const recipients = tried.map((r) => r.to).sort();
    expect(recipients).toEqual(["foreman@brennan-twp.example", "supervisor@brennan-twp.example", "trustee@brennan-twp.example"]);

    await app.stop();
    smtp = await startFakeSmtp({ smtpPort, httpPort: 0 });
    app = await startApp(env);
    expect(await app.ready()).toBe("running");

    await until(async () => smtp!.messages.filter((m) => m.subject.includes("ready")).length >= 3, "delivery after the restart");
    // Give a duplicate every chance to show up.
    await new Promise((r) => setTimeout(r, 6_000));
    const delivered = smtp.messages.filter((m) => m.subject.includes("ready")).flatMap((m) => m.to).sort();
    expect(delivered).toEqual(recipients);
    const rows = await handle.db.select().from(mailOutbox).where(readyMail);
    expect(rows.every((r) => r.status === "sent")).toBe(true);
  });
});
