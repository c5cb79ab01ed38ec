import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { findUserForSignIn, recentSignInFailures, recordSignIn, recordSignInFailure } from "@/db/queries/users";
import { env } from "@/lib/env";
import { verifyPassword } from "./password";
import { THROTTLE_WINDOW_MINUTES, throttleVerdict } from "./throttle-policy";

const credentials = z.object({
  email: z.string().trim().toLowerCase().email().max(200),
  password: z.string().min(1).max(200),
});

// A constant-cost comparison for unknown e-mails, so timing does not tell which addresses exist.
const DUMMY_HASH = "$2b$10$/S6uB6B4lHqs246NOEfNHOO79rqFlQ0sdXJA.VdhQzGdeFZglS1zC";

function clientIp(headers: Record<string, unknown> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  const first = typeof forwarded === "string" ? forwarded.split(",")[0]?.trim() : undefined;
  const real = headers?.["x-real-ip"];
  return first || (typeof real === "string" ? real : "") || "unknown";
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export const SIGN_IN_FAILED = "That e-mail and password do not match an account. Check both and try again.";

export function authOptions(): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    // Stateless sessions: any app instance can read them, no shared memory needed.
    session: { strategy: "jwt", maxAge: 14 * 24 * 60 * 60 },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "E-mail and password",
        credentials: { email: { type: "email" }, password: { type: "password" } },
        async authorize(raw, req) {
          const parsed = credentials.safeParse(raw);
          if (!parsed.success) return null;
          const ip = clientIp(req?.headers as Record<string, unknown> | undefined);
          const since = new Date(Date.now() - THROTTLE_WINDOW_MINUTES * 60_000).toISOString();
          const recent = await recentSignInFailures(ip, since);
          const verdict = throttleVerdict(recent.failures, recent.oldestAt ? Date.now() - Date.parse(recent.oldestAt) : 0);
          if (verdict.kind === "locked") {
            throw new Error(
              `Too many failed sign-ins from this address. Try again in ${verdict.retryAfterMinutes} minute${verdict.retryAfterMinutes === 1 ? "" : "s"}.`,
            );
          }
          if (verdict.delayMs > 0) await sleep(verdict.delayMs);

          const user = await findUserForSignIn(parsed.data.email);
          const ok = await verifyPassword(parsed.data.password, user?.passwordHash ?? DUMMY_HASH);
          if (!user || !ok || !user.active) {
            await recordSignInFailure(ip, parsed.data.email);
            return null;
          }
          await recordSignIn(user.id);
          return { id: user.id, name: user.name, email: user.email, role: user.role, accountId: user.accountId, sessionVersion: user.sessionVersion };
        },
      }),
    ],
    callbacks: {
      jwt({ token, user }) {
        if (user) {
          const u = user as { id: string; role?: string; accountId?: string | null; sessionVersion?: number };
          token.sub = u.id;
          token.role = u.role;
          token.accountId = u.accountId ?? null;
          // Checked against the users row on every request (lib/auth/resolve-user.ts).
          token.sv = u.sessionVersion ?? 0;
        }
        return token;
      },
      session({ session, token }) {
        return {
          ...session,
          user: { ...session.user, id: token.sub, role: token.role, accountId: token.accountId },
        };
      },
    },
  };
}
