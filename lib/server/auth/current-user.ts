import "server-only";
import { cookies } from "next/headers";
import { unauthorized } from "next/navigation";
import { cache } from "react";
import { SESSION_COOKIES, userFromSessionToken } from "./resolve-user";
import type { SessionUser } from "@/lib/auth/session-user";

/** The signed-in user for a page, layout or server action (one lookup per request). */
export const currentUser = cache(async (): Promise<SessionUser | null> => {
  const jar = await cookies();
  for (const name of SESSION_COOKIES) {
    const token = jar.get(name)?.value;
    if (token) return userFromSessionToken(token);
  }
  return null;
});

export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  // Renders app/unauthorized.tsx, which sends the browser to sign in and back here.
  if (!user) unauthorized();
  return user;
}
