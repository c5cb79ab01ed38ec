import { existsSync } from "node:fs";
import { startFakeSmtp } from "./smtp/server";
import { startFakeStripe } from "./stripe/server";
import { startFakeUploadThing } from "./uploadthing/server";
import { fakeStorageDir } from "./uploadthing/storage-dir";

// Read the same .env files Next.js reads, so "is a real key configured?" has one answer.
for (const file of [".env.local", ".env"]) if (existsSync(file)) process.loadEnvFile(file);

/** Starts a local fake for every hosted service that has no real configuration. */
async function main() {
  const started: string[] = [];
  if (!process.env.SMTP_URL) {
    const smtp = await startFakeSmtp({
      smtpPort: Number(process.env.FAKE_SMTP_PORT ?? 2525),
      httpPort: Number(process.env.FAKE_SMTP_HTTP_PORT ?? 2526),
    });
    started.push(`mail catcher: smtp://127.0.0.1:${smtp.smtpPort} (the owner sees outgoing mail at /settings/mail)`);
  }
  if (!process.env.STRIPE_SECRET_KEY) {
    const appUrl = (process.env.NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/$/, "");
    const webhookUrl = `${appUrl}/api/webhooks/stripe`;
    const payments = await startFakeStripe({
      port: Number(process.env.FAKE_STRIPE_PORT ?? 12111),
      webhookUrl,
      webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || "whsec_cotter_local_fake",
      stateFile: "mocks/.storage/payments.json",
      log: (line) => {
        if (!/^(GET|POST) /.test(line)) console.log(`[fake-payments] ${line}`);
      },
    });
    started.push(`card payments: ${payments.url} (test card 4242 4242 4242 4242; webhooks to ${webhookUrl})`);
  }
  if (!process.env.UPLOADTHING_TOKEN) {
    // The app derives the same fake token and address from FAKE_UPLOADTHING_PORT (lib/uploads/config.ts).
    const uploads = await startFakeUploadThing({
      port: Number(process.env.FAKE_UPLOADTHING_PORT ?? 12112),
      storageDir: fakeStorageDir(),
    });
    started.push(`uploads: ${uploads.url} (files kept in ${fakeStorageDir()})`);
  }
  console.log(started.length ? `Local fakes running:\n  ${started.join("\n  ")}` : "All services configured; no fakes started.");
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
