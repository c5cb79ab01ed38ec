import { describe, expect, it } from "vitest";
import { environmentProblems } from "@/lib/env";

// A real deployment (issue 9): production without COTTER_DEMO names every missing choice.
const SECRET = "a-real-secret-of-at-least-32-characters!";
const live = { NODE_ENV: "production", NEXTAUTH_URL: "https://cotter.example", NEXTAUTH_SECRET: SECRET };
const services = { SMTP_URL: "smtps://u:p@smtp.example:465", STRIPE_SECRET_KEY: "sk_live_x", STRIPE_WEBHOOK_SECRET: "whsec_real", UPLOADTHING_TOKEN: "token" };
const vars = (problems: string[]) => problems.map((p) => p.split(":")[0]);

describe("environment at start", () => {
  it("lets development, tests and the demo run on the fakes with no keys", () => {
    expect(environmentProblems({})).toEqual([]);
    expect(environmentProblems({ NODE_ENV: "test" })).toEqual([]);
    expect(environmentProblems({ NODE_ENV: "production", COTTER_DEMO: "1" })).toEqual([]);
  });

  it("accepts a fully configured production", () => {
    expect(environmentProblems({ ...live, ...services })).toEqual([]);
  });

  it("in production names each service with neither a key nor an explicit fake, and the sign-in settings", () => {
    expect(vars(environmentProblems({ NODE_ENV: "production" })).sort()).toEqual(
      ["NEXTAUTH_SECRET", "NEXTAUTH_URL", "SMTP_URL", "STRIPE_SECRET_KEY", "UPLOADTHING_TOKEN"].sort(),
    );
    const problems = environmentProblems({ ...live, ...services, UPLOADTHING_TOKEN: undefined });
    expect(problems).toEqual(["UPLOADTHING_TOKEN: UPLOADTHING_TOKEN is not set: set it for photo uploads, or set COTTER_USE_FAKE_UPLOADTHING=1 to use the local fake on purpose"]);
  });

  it("accepts a fake chosen in so many words", () => {
    expect(environmentProblems({ ...live, ...services, UPLOADTHING_TOKEN: undefined, COTTER_USE_FAKE_UPLOADTHING: "1" })).toEqual([]);
  });

  it("refuses a payment key without a webhook secret", () => {
    expect(vars(environmentProblems({ ...live, ...services, STRIPE_WEBHOOK_SECRET: undefined }))).toEqual(["STRIPE_WEBHOOK_SECRET"]);
  });

  it("never accepts the fake's public webhook secret in production, with a key or with the fake", () => {
    expect(vars(environmentProblems({ ...live, ...services, STRIPE_WEBHOOK_SECRET: "whsec_cotter_local_fake" }))).toEqual(["STRIPE_WEBHOOK_SECRET"]);
    const fake = { ...live, ...services, STRIPE_SECRET_KEY: undefined, COTTER_USE_FAKE_STRIPE: "1" };
    expect(vars(environmentProblems({ ...fake, STRIPE_WEBHOOK_SECRET: "whsec_cotter_local_fake" }))).toEqual(["STRIPE_WEBHOOK_SECRET"]);
    expect(vars(environmentProblems({ ...fake, STRIPE_WEBHOOK_SECRET: undefined }))).toEqual(["STRIPE_WEBHOOK_SECRET"]);
  });

  it("reads the proxy count as a whole number", () => {
    expect(vars(environmentProblems({ COTTER_TRUSTED_PROXIES: "one" }))).toEqual(["COTTER_TRUSTED_PROXIES"]);
    expect(environmentProblems({ COTTER_TRUSTED_PROXIES: "2" })).toEqual([]);
  });
});
