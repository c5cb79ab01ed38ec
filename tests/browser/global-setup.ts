import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";
import { startFakeSmtp } from "@/mocks/smtp/server";
import { startFakeStripe } from "@/mocks/stripe/server";
import { startFakeUploadThing } from "@/mocks/uploadthing/server";
import { APP_MAILBOX, mailbox } from "@/tests/support/mailbox";
import { freePort } from "@/tests/support/ports";
import { root, startRunningNextServer, testDistDir as distDir } from "@/tests/support/next-server";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    paymentsUrl: string;
    /** The app's database file, for tests that read ids or check that nothing changed. */
    dbUrl: string;
    /** The server's NEXTAUTH_SECRET, for tests that mint a session cookie instead of signing in. */
    authSecret: string;
    /** The test build's directory, for tests that start a server of their own. */
    distDir: string;
  }
}

/**
 * Builds the app once, gives it a fresh demo database and local fakes of the
 * hosted services, serves it with `next start`, and tells the tests where.
 * COTTER_TEST_SKIP_BUILD=1 reuses an earlier test build while iterating.
 */
export default async function setup(project: TestProject) {
  // Tests use the local upload fake even on a machine with a real key configured.
  delete process.env.UPLOADTHING_TOKEN;
  const env = { ...process.env, NEXT_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1" };
  if (!(process.env.COTTER_TEST_SKIP_BUILD === "1" && existsSync(path.join(root, distDir)))) {
    const build = spawnSync("npx", ["next", "build"], { cwd: root, env, stdio: "inherit" });
    if (build.status !== 0) throw new Error("next build failed");
  }

  const dir = path.join(root, "tests", ".artifacts", "browser");
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const dbUrl = `file:${path.join(dir, "cotter.db")}`;
  // The seed stores its drawn photos where this run's upload fake keeps files.
  const uploadsDir = path.join(dir, "uploads");
  process.env.FAKE_UPLOADTHING_STORAGE = uploadsDir;
  await migrateDatabase(dbUrl);
  await seedDatabase(dbUrl);

  // The run's one mail catcher: the shared server and any server a test starts each send to a mailbox of their own.
  const smtp = await startFakeSmtp({ keep: 20_000 });
  const mailCatcher = { smtpPort: smtp.smtpPort, httpUrl: `http://127.0.0.1:${smtp.httpPort}` };
  const uploads = await startFakeUploadThing({ port: 0, storageDir: uploadsDir });
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const webhookSecret = "whsec_browser_tests";
  const authSecret = "browser-tests-secret-browser-tests-secret";
  // Retries come quickly here, in the same rising shape as the service's.
  const payments = await startFakeStripe({ port: 0, webhookUrl: `${baseUrl}/api/webhooks/stripe`, webhookSecret, retryDelaysMs: [500, 2_000, 5_000] });
  const server = await startRunningNextServer({
    distDir,
    port,
    env: {
      DATABASE_URL: dbUrl,
      NEXTAUTH_SECRET: authSecret,
      SMTP_URL: mailbox(mailCatcher, APP_MAILBOX).smtpUrl,
      STRIPE_SECRET_KEY: "",
      // A production server: the fakes only because we say so (lib/env.ts).
      COTTER_USE_FAKE_STRIPE: "1",
      COTTER_USE_FAKE_UPLOADTHING: "1",
      FAKE_STRIPE_PORT: String(payments.port),
      STRIPE_WEBHOOK_SECRET: webhookSecret,
      // No UPLOADTHING_TOKEN: the app points the SDK at the fake on this port (lib/uploads/config.ts).
      FAKE_UPLOADTHING_PORT: new URL(uploads.url).port,
    },
  });

  project.provide("baseUrl", baseUrl);
  project.provide("mailCatcher", mailCatcher);
  project.provide("paymentsUrl", payments.url);
  project.provide("dbUrl", dbUrl);
  project.provide("authSecret", authSecret);
  project.provide("distDir", distDir);

  return async () => {
    await Promise.all([server.stop(), smtp.close(), uploads.close(), payments.close()]);
  };
}
