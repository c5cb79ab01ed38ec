import { z } from "zod";
import { isTimeZone } from "./format";

/**
 * Environment, validated once. Every hosted service has a local fake in
 * mocks/; when a service's key is absent the app points the same SDK at the
 * fake's address, so one machine runs the whole product with nothing to sign
 * up for.
 */
const DEMO_SECRET = "cotter-local-demo-secret-do-not-use-in-production";

const boolish = z
  .enum(["1", "0", "true", "false", ""])
  .optional()
  .transform((v) => v === "1" || v === "true");

const schema = z
  .object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
    COTTER_DEMO: boolish,
    DATABASE_URL: z
      .string()
      .regex(/^(file:|libsql:|https?:|wss?:)/, "DATABASE_URL must be a file: path or a libSQL server URL")
      .default("file:./data/cotter.db"),
    DATABASE_AUTH_TOKEN: z.string().optional(),
    NEXTAUTH_URL: z.url().default("http://localhost:3000"),
    NEXTAUTH_SECRET: z.string().min(32, "NEXTAUTH_SECRET must be at least 32 characters").optional(),
    APP_TIME_ZONE: z.string().refine(isTimeZone, "APP_TIME_ZONE must be an IANA zone such as America/Chicago").default("America/Chicago"),

    SMTP_URL: z.string().optional(),
    MAIL_FROM: z.string().default("Quarry Road Truck & Equipment <service@quarry-road.example>"),
    FAKE_SMTP_PORT: z.coerce.number().int().default(2525),
    FAKE_SMTP_HTTP_PORT: z.coerce.number().int().default(2526),

    STRIPE_SECRET_KEY: z.string().optional(),
    STRIPE_WEBHOOK_SECRET: z.string().default("whsec_cotter_local_fake"),
    FAKE_STRIPE_PORT: z.coerce.number().int().default(12111),

    UPLOADTHING_TOKEN: z.string().optional(),
    FAKE_UPLOADTHING_PORT: z.coerce.number().int().default(12112),
  })
  .transform((env, ctx) => {
    let secret = env.NEXTAUTH_SECRET;
    if (!secret) {
      if (env.NODE_ENV === "production" && !env.COTTER_DEMO) {
        ctx.addIssue({ code: "custom", path: ["NEXTAUTH_SECRET"], message: "NEXTAUTH_SECRET is required in production" });
      }
      secret = DEMO_SECRET;
    }
    return { ...env, NEXTAUTH_SECRET: secret };
  });

export type Env = z.infer<typeof schema>;

let cached: Env | undefined;

export function env(): Env {
  if (!cached) {
    const parsed = schema.safeParse(process.env);
    if (!parsed.success) {
      const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
      throw new Error(`Invalid environment:\n${lines.join("\n")}`);
    }
    cached = parsed.data;
  }
  return cached;
}

/** Tests change the environment between files; let them start over. */
export function resetEnvCache(): void {
  cached = undefined;
}
