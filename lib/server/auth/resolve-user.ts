import "server-only";
import { decode } from "next-auth/jwt";
import { findActiveUser, findUserByTokenHash, touchApiToken } from "@/db/queries/users";
import { env } from "@/lib/env";
import type { SessionUser } from "@/lib/auth/session-user";
import { hashApiToken, looksLikeApiToken } from "@/lib/auth/tokens";

export const SESSION_COOKIES = ["__Secure-next-auth.session-token", "next-auth.session-token"] as const;

function readCookie(cookieHeader: string, name: string): string | undefined {
  for (const part of cookieHeader.split(";")) {
    const eq = part.indexOf("=");
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}

/**
 * The session cookie's JWT, or null when absent, expired, forged, or signed in
 * before the person's password was last reset or changed (the token's session
 * version is older than the row's).
 */
export async function userFromSessionToken(token: string | undefined): Promise<SessionUser | null> {
  if (!token) return null;
  const payload = await decode({ token, secret: env().NEXTAUTH_SECRET }).catch(() => null);
  if (!payload?.sub) return null;
  const found = await findActiveUser(payload.sub);
  if (!found) return null;
  const { sessionVersion, ...user } = found;
  // Sessions from before versions existed carry none: they count as version 0.
  const tokenVersion = typeof payload.sv === "number" ? payload.sv : 0;
  if (tokenVersion !== sessionVersion) return null;
  return { ...user, via: "session" };
}

export function sessionTokenFromCookieHeader(cookieHeader: string | null): string | undefined {
  if (!cookieHeader) return undefined;
  for (const name of SESSION_COOKIES) {
    const value = readCookie(cookieHeader, name);
    if (value) return value;
  }
  return undefined;
}

// Writing lastUsedAt on every call would make each read a write; once a minute is plenty.
const TOUCH_INTERVAL_MS = 60_000;

export async function userFromBearer(authorization: string | null): Promise<SessionUser | null | "invalid"> {
  if (!authorization) return null;
  const match = /^Bearer\s+(\S+)$/i.exec(authorization);
  if (!match?.[1] || !looksLikeApiToken(match[1])) return "invalid";
  const row = await findUserByTokenHash(hashApiToken(match[1]));
  if (!row) return "invalid";
  if (!row.lastUsedAt || Date.now() - Date.parse(row.lastUsedAt) > TOUCH_INTERVAL_MS) {
    await touchApiToken(row.tokenId);
  }
  const { tokenId: _t, lastUsedAt: _l, ...user } = row;
  return { ...user, via: "token" };
}

/** A route handler's caller: a Bearer token if one is sent, else the session cookie. */
export async function userFromRequest(request: Request): Promise<SessionUser | null> {
  const bearer = await userFromBearer(request.headers.get("authorization"));
  if (bearer === "invalid") return null;
  if (bearer) return bearer;
  return userFromSessionToken(sessionTokenFromCookieHeader(request.headers.get("cookie")));
}
