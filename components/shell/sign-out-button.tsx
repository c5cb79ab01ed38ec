"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => void signOut({ callbackUrl: "/sign-in" })}
      className="min-h-touch px-2 text-sm font-semibold underline decoration-rule-strong underline-offset-4 hover:decoration-ink"
    >
      Sign out
    </button>
  );
}
