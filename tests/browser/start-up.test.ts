// Start-up (issue 9): a production server with a half-made configuration
// stops at once and says which variable; the demo and a full set start.
// Each case spawns `next start` on the test build with its own environment.
import { spawn } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { inject } from "vitest";

const root = path.join(import.meta.dirname, "..", "..");

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

/** Starts the server; resolves with its exit code and output, or "running" once it answers (then stops it). */
async function start(extra: Record<string, string>): Promise<{ outcome: number | "running"; output: string }> {
  const port = await freePort();
  const env: NodeJS.ProcessEnv = {
    PATH: process.env.PATH ?? "",
    HOME: process.env.HOME ?? "",
    NEXT_DIST_DIR: inject("distDir"),
    NEXT_TELEMETRY_DISABLED: "1",
    NODE_ENV: "production",
    DATABASE_URL: inject("dbUrl"),
    ...extra,
  };
  const child = spawn(path.join(root, "node_modules", ".bin", "next"), ["start", "-p", String(port), "-H", "127.0.0.1"], { cwd: root, env, stdio: ["ignore", "pipe", "pipe"] });
  let output = "";
  child.stdout.on("data", (d: Buffer) => (output += d.toString()));
  child.stderr.on("data", (d: Buffer) => (output += d.toString()));
  const exited = new Promise<number>((resolve) => child.on("exit", (code) => resolve(code ?? -1)));
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    const code = await Promise.race([exited, new Promise<null>((r) => setTimeout(() => r(null), 300))]);
    if (code !== null) return { outcome: code, output };
    const ok = await fetch(`http://127.0.0.1:${port}/api/v1/health`).then((r) => r.ok, () => false);
    if (ok) {
      child.kill("SIGTERM");
      await exited;
      return { outcome: "running", output };
    }
  }
  child.kill("SIGKILL");
  throw new Error(`the server neither started nor stopped:\n${output}`);
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
