/**
 * Starts the local payment fake from the environment:
 *   FAKE_STRIPE_PORT (12111), STRIPE_WEBHOOK_SECRET ("whsec_cotter_local_fake"),
 *   APP_URL (http://localhost:3000; events go to `${APP_URL}/api/webhooks/stripe`),
 *   FAKE_STRIPE_HOST (127.0.0.1), FAKE_STRIPE_PUBLIC_URL (hosted page base URL),
 *   FAKE_STRIPE_STATE_FILE (optional JSON file that keeps state across restarts).
 * Run with `npx tsx mocks/stripe/main.ts`.
 */
import { startFakeStripe } from "./server";

function port(text: string | undefined, fallback: number): number {
  if (text === undefined || text === "") return fallback;
  const n = Number(text);
  if (!Number.isInteger(n) || n < 0 || n > 65535) throw new Error(`FAKE_STRIPE_PORT is not a port: ${text}`);
  return n;
}

const env = process.env;
const appUrl = (env.APP_URL || "http://localhost:3000").replace(/\/$/, "");
const webhookUrl = `${appUrl}/api/webhooks/stripe`;

const fake = await startFakeStripe({
  port: port(env.FAKE_STRIPE_PORT, 12111),
  host: env.FAKE_STRIPE_HOST || "127.0.0.1",
  webhookUrl,
  webhookSecret: env.STRIPE_WEBHOOK_SECRET || "whsec_cotter_local_fake",
  publicUrl: env.FAKE_STRIPE_PUBLIC_URL || undefined,
  stateFile: env.FAKE_STRIPE_STATE_FILE || undefined,
  log: (line) => console.log(`[fake-payments] ${line}`),
});

console.log(`[fake-payments] local test payment service on ${fake.url} (webhooks → ${webhookUrl})`);

for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.once(signal, () => {
    void fake.close().then(() => process.exit(0));
  });
}
