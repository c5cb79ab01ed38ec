import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { recentSignInFailures, recordSignIn, recordSignInFailure, recordThrottledSignIn } from "@/db/queries/sign-in";
import { findUserForSignIn } from "@/db/queries/users";
import { env } from "@/lib/env";
import { verifyPassword } from "@/lib/auth/password";
import { clientAddress } from "@/lib/server/http/client-address";
import { lockedMessage, THROTTLE_WINDOW_MINUTES, throttleVerdict } from "@/lib/auth/throttle-policy";

const credentials = z.object({
  email: z.string().trim().toLowerCase().email().max(200),
  password: z.string().min(1).max(200),
});

// A constant-cost comparison for unknown e-mails, so timing does not tell which addresses exist.
const DUMMY_HASH = "$2b$10$/S6uB6B4lHqs246NOEfNHOO79rqFlQ0sdXJA.VdhQzGdeFZglS1zC";

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

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
          const headers = (req?.headers ?? {}) as Record<string, unknown>;
          const header = (name: string) => (typeof headers[name] === "string" ? (headers[name] as string) : undefined);
          const address = clientAddress(header, env().COTTER_TRUSTED_PROXIES);
          const email = parsed.data.email;
          const since = new Date(Date.now() - THROTTLE_WINDOW_MINUTES * 60_000).toISOString();
          const recent = await recentSignInFailures(email, address, since);
          const verdict = throttleVerdict(recent.account, recent.address);
          const counts = { email, address, accountFailures: recent.account.failures, addressFailures: recent.address.failures };
          if (verdict.kind === "locked") {
            await recordThrottledSignIn({ ...counts, outcome: verdict.scope === "account" ? "locked_account" : "locked_address", delayMs: 0 });
            throw new Error(lockedMessage(verdict));
          }
          if (verdict.delayMs > 0) {
            await recordThrottledSignIn({ ...counts, outcome: "delayed", delayMs: verdict.delayMs });
            await sleep(verdict.delayMs);
          }

          const user = await findUserForSignIn(email);
          const ok = await verifyPassword(parsed.data.password, user?.passwordHash ?? DUMMY_HASH);
          if (!user || !ok || !user.active) {
            await recordSignInFailure(address, email);
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
          // Checked against the users row on every request (lib/server/auth/resolve-user.ts).
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
