"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";

const WRONG_PASSWORD = "That e-mail and password do not match an account. Check both and try again.";

export function SignInForm({ next }: { next: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(null);
    const result = await signIn("credentials", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
    }).catch(() => null);
    if (result?.ok && !result.error) {
      router.replace(next);
      router.refresh();
      return;
    }
    setBusy(false);
    if (!result) setError("Cotter could not be reached. Check your connection and try again.");
    else setError(result.error === "CredentialsSignin" ? WRONG_PASSWORD : (result.error ?? WRONG_PASSWORD));
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">E-mail</span>
        <input
          name="email"
          type="email"
          autoComplete="username"
          required
          className="min-h-touch rounded-card border-2 border-rule-strong bg-white px-3 text-base focus:border-ink"
        />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Password</span>
        <input
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className="min-h-touch rounded-card border-2 border-rule-strong bg-white px-3 text-base focus:border-ink"
        />
      </label>
      {error ? (
        <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
          {error}
        </p>
      ) : null}
      <Button type="submit" disabled={busy}>
        {busy ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
