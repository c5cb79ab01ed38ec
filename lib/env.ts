import { z } from "zod";
import { isTimeZone } from "./format";

/**
 * Environment, validated once. Every hosted service has a local fake in
 * mocks/; when a service's key is absent the app points the same SDK at the
 * fake's address, so one machine runs the whole product with nothing to sign
 * up for.
 */
const DEMO_SECRET = "cotter-local-demo-secret-do-not-use-in-production";
/** The payment fake's webhook secret, printed in .env.example: public, so never good enough in production. */
export const FAKE_WEBHOOK_SECRET = "whsec_cotter_local_fake";

const boolish = z
  .enum(["1", "0", "true", "false", ""])
  .optional()
  .transform((v) => v === "1" || v === "true");

const fields = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  COTTER_DEMO: boolish,
  DATABASE_URL: z
    .string()
    .regex(/^(file:|libsql:|https?:|wss?:)/, "DATABASE_URL must be a file: path or a libSQL server URL")
    .default("file:./data/cotter.db"),
  DATABASE_AUTH_TOKEN: z.string().optional(),
  NEXTAUTH_URL: z.url().optional(),
  NEXTAUTH_SECRET: z.string().min(32, "NEXTAUTH_SECRET must be at least 32 characters").optional(),
  APP_TIME_ZONE: z.string().refine(isTimeZone, "APP_TIME_ZONE must be an IANA zone such as America/Chicago").default("America/Chicago"),

  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default("Quarry Road Truck & Equipment <service@quarry-road.example>"),
  FAKE_SMTP_PORT: z.coerce.number().int().default(2525),
  FAKE_SMTP_HTTP_PORT: z.coerce.number().int().default(2526),

  STRIPE_SECRET_KEY: z.string().optional(),
  STRIPE_WEBHOOK_SECRET: z.string().optional(),
  FAKE_STRIPE_PORT: z.coerce.number().int().default(12111),

  UPLOADTHING_TOKEN: z.string().optional(),
  FAKE_UPLOADTHING_PORT: z.coerce.number().int().default(12112),

  // In production a service without its key runs on its local fake only when asked to in so many words.
  COTTER_USE_FAKE_SMTP: boolish,
  COTTER_USE_FAKE_STRIPE: boolish,
  COTTER_USE_FAKE_UPLOADTHING: boolish,
  /** How many reverse proxies sit in front of the app; 0 means X-Forwarded-For is never believed. */
  COTTER_TRUSTED_PROXIES: z.coerce.number().int("COTTER_TRUSTED_PROXIES must be a whole number").min(0).max(10).default(0),
});

const schema = fields.transform((env, ctx) => {
  const live = env.NODE_ENV === "production" && !env.COTTER_DEMO;
  const refuse = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
  if (live) productionRules(env, refuse);
  return {
    ...env,
    NEXTAUTH_URL: env.NEXTAUTH_URL ?? "http://localhost:3000",
    NEXTAUTH_SECRET: env.NEXTAUTH_SECRET || DEMO_SECRET,
    STRIPE_WEBHOOK_SECRET: env.STRIPE_WEBHOOK_SECRET || FAKE_WEBHOOK_SECRET,
  };
});

type Parsed = z.output<typeof fields>;

/**
 * A real deployment (production, not the demo) states every choice: each
 * hosted service has its key or an explicit COTTER_USE_FAKE_<SERVICE>=1, and
 * nothing falls back to a value printed in the repository.
 */
function productionRules(env: Parsed, refuse: (path: string, message: string) => void): void {
  if (!env.NEXTAUTH_URL) refuse("NEXTAUTH_URL", "NEXTAUTH_URL is required in production: the address people open, e.g. https://cotter.example");
  if (!env.NEXTAUTH_SECRET) refuse("NEXTAUTH_SECRET", "NEXTAUTH_SECRET is required in production (32+ random characters)");
  const services = [
    ["SMTP_URL", env.SMTP_URL, "COTTER_USE_FAKE_SMTP", env.COTTER_USE_FAKE_SMTP, "e-mail"],
    ["STRIPE_SECRET_KEY", env.STRIPE_SECRET_KEY, "COTTER_USE_FAKE_STRIPE", env.COTTER_USE_FAKE_STRIPE, "card payments"],
    ["UPLOADTHING_TOKEN", env.UPLOADTHING_TOKEN, "COTTER_USE_FAKE_UPLOADTHING", env.COTTER_USE_FAKE_UPLOADTHING, "photo uploads"],
  ] as const;
  for (const [keyName, key, fakeName, useFake, what] of services) {
    if (!key && !useFake) refuse(keyName, `${keyName} is not set: set it for ${what}, or set ${fakeName}=1 to use the local fake on purpose`);
  }
  if (env.STRIPE_SECRET_KEY && !env.STRIPE_WEBHOOK_SECRET) {
    refuse("STRIPE_WEBHOOK_SECRET", "STRIPE_SECRET_KEY is set but STRIPE_WEBHOOK_SECRET is not: copy the signing secret of the webhook endpoint");
  }
  if (env.STRIPE_WEBHOOK_SECRET === FAKE_WEBHOOK_SECRET) {
    refuse("STRIPE_WEBHOOK_SECRET", "STRIPE_WEBHOOK_SECRET is the local fake's public value; anyone could sign payment events with it");
  }
  if (env.COTTER_USE_FAKE_STRIPE && !env.STRIPE_SECRET_KEY && !env.STRIPE_WEBHOOK_SECRET) {
    refuse("STRIPE_WEBHOOK_SECRET", "STRIPE_WEBHOOK_SECRET is required in production, also with the payment fake");
  }
}

export type Env = z.infer<typeof schema>;

let cached: Env | undefined;

/** The environment's problems, one line per variable, or none. */
export function environmentProblems(source: Record<string, string | undefined>): string[] {
  const parsed = schema.safeParse(source);
  return parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
}

export function env(): Env {
  if (!cached) {
    const parsed = schema.safeParse(process.env);
    if (!parsed.success) {
      const lines = environmentProblems(process.env).map((line) => `  ${line}`);
      throw new Error(`Cotter cannot start: the environment is not valid.\n${lines.join("\n")}\nSee "Going live" in README.md.`);
    }
    cached = parsed.data;
  }
  return cached;
}

/** Tests change the environment between files; let them start over. */
export function resetEnvCache(): void {
  cached = undefined;
}
