import path from "node:path";
import { inject } from "vitest";
import { startFakeStripe } from "@/mocks/stripe/server";
import { startFakeUploadThing } from "@/mocks/uploadthing/server";
import { mailbox } from "@/tests/support/mailbox";
import { startRunningNextServer, type NextServer } from "@/tests/support/next-server";
import { freePort } from "@/tests/support/ports";

export interface OwnAppServer {
  app: NextServer;
  /** Stops the app, then its payment and upload fakes. */
  stop(): Promise<void>;
}

/**
 * A production server of the run's build on a database of its own, beside the
 * demo server the other browser tests share: its own port, payment and upload
 * fakes (named as production start-up requires), and a mailbox of its own in
 * the run's mail catcher. For tests whose writes must not reach the others.
 */
export async function startOwnAppServer(opts: { name: string; dir: string; dbUrl: string; env?: Record<string, string> }): Promise<OwnAppServer> {
  const secret = `whsec_${opts.name.replace(/\W/g, "_")}`;
  const port = await freePort();
  const uploads = await startFakeUploadThing({ port: 0, storageDir: path.join(opts.dir, "uploads") });
  const payments = await startFakeStripe({ port: 0, webhookUrl: `http://127.0.0.1:${port}/api/webhooks/stripe`, webhookSecret: secret, retryDelaysMs: [500] });
  const app = await startRunningNextServer({
    distDir: inject("distDir"),
    port,
    env: {
      DATABASE_URL: opts.dbUrl,
      NEXTAUTH_SECRET: `${opts.name}-secret-`.padEnd(40, "0"),
      SMTP_URL: mailbox(inject("mailCatcher"), opts.name).smtpUrl,
      STRIPE_SECRET_KEY: "",
      // A production server: the fakes only because we say so (lib/env.ts).
      COTTER_USE_FAKE_STRIPE: "1",
      COTTER_USE_FAKE_UPLOADTHING: "1",
      FAKE_STRIPE_PORT: String(payments.port),
      STRIPE_WEBHOOK_SECRET: secret,
      FAKE_UPLOADTHING_PORT: new URL(uploads.url).port,
      ...opts.env,
    },
  });
  return {
    app,
    async stop() {
      await app.stop();
      await Promise.all([uploads.close(), payments.close()]);
    },
  };
}
