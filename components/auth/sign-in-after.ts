"use client";

import { signIn } from "next-auth/react";

/** After a password is set or changed, sign in with it, so the person lands where they meant to go. */
export async function signInWith(email: string, password: string): Promise<boolean> {
  const result = await signIn("credentials", { email, password, redirect: false }).catch(() => null);
  return Boolean(result?.ok && !result.error);
}
