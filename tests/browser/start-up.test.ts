// Start-up (issue 9): a production server with a half-made configuration
// stops at once and says which variable; the demo and a full set start.
// Each case spawns `next start` on the test build with its own environment.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { migrateDatabase } from "@/db/migrate";
import { startNextServer, type NextServer } from "@/tests/support/next-server";

/** `next start` of the test build with exactly the environment given (plus PATH and HOME). */
const startApp = (env: Record<string, string>): Promise<NextServer> => startNextServer({ distDir: inject("distDir"), env, inheritEnv: false });

// A database of its own: a server started here must not touch (or send) the shared test server's mail.
const dir = mkdtempSync(path.join(tmpdir(), "cotter-start-up-"));
const dbUrl = `file:${path.join(dir, "cotter.db")}`;
beforeAll(() => migrateDatabase(dbUrl));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Starts the server; resolves with its exit code and output, or "running" once it answers (then stops it). */
async function start(extra: Record<string, string>): Promise<{ outcome: number | "running"; output: string }> {
  const app = await startApp({ DATABASE_URL: dbUrl, ...extra });
  const outcome = await app.ready();
  await app.stop();
  return { outcome, output: app.output() };
}

const SECRET = "start-up-tests-secret-start-up-tests-secret";
const full = {
  NEXTAUTH_URL: "https://cotter.example",
  NEXTAUTH_SECRET: SECRET,
  SMTP_URL: "smtp://127.0.0.1:1",
  COTTER_USE_FAKE_STRIPE: "1",
  STRIPE_WEBHOOK_SECRET: "whsec_start_up_tests",
  COTTER_USE_FAKE_UPLOADTHING: "1",
};

describe("start-up in production", () => {
  it("stops with nothing configured, naming every variable a real deployment must set", async () => {
    const { outcome, output } = await start({});
    expect(outcome).toBe(1);
    expect(output).toContain("Cotter cannot start: the environment is not valid.");
    for (const name of ["NEXTAUTH_URL", "NEXTAUTH_SECRET", "SMTP_URL", "STRIPE_SECRET_KEY", "UPLOADTHING_TOKEN"]) expect(output).toContain(`${name}: `);
    expect(output).toContain('See "Going live" in README.md.');
  });

  it("stops when a payment key has no webhook secret", async () => {
    const { outcome, output } = await start({ ...full, COTTER_USE_FAKE_STRIPE: "", STRIPE_WEBHOOK_SECRET: "", STRIPE_SECRET_KEY: "sk_live_start_up_test" });
    expect(outcome).toBe(1);
    expect(output).toContain("STRIPE_WEBHOOK_SECRET: STRIPE_SECRET_KEY is set but STRIPE_WEBHOOK_SECRET is not");
  });

  it("stops on the fake's public webhook secret", async () => {
    const { outcome, output } = await start({ ...full, STRIPE_WEBHOOK_SECRET: "whsec_cotter_local_fake" });
    expect(outcome).toBe(1);
    expect(output).toContain("STRIPE_WEBHOOK_SECRET is the local fake's public value");
  });

  it("stops on a service left on its fake without saying so", async () => {
    const { outcome, output } = await start({ ...full, COTTER_USE_FAKE_UPLOADTHING: "" });
    expect(outcome).toBe(1);
    expect(output).toContain("UPLOADTHING_TOKEN is not set");
  });

  it("starts with every choice made, and the demo starts with none", async () => {
    expect((await start(full)).outcome).toBe("running");
    expect((await start({ COTTER_DEMO: "1" })).outcome).toBe("running");
  });
});
