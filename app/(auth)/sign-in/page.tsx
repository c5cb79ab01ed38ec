import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { AuthFrame } from "@/components/auth/auth-frame";
import { SignInForm } from "@/components/auth/sign-in-form";
import { needsSetup } from "@/db/queries/setup";
import { currentUser } from "@/lib/server/auth/current-user";
import { safeNextPath } from "@/lib/http/safe-next";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const params = await searchParams;
  const next = safeNextPath(params.callbackUrl ?? params.next);
  // A brand-new install has nobody to sign in: it starts with the one-time set-up.
  if (await needsSetup()) redirect("/setup");
  if (await currentUser()) redirect(next);
  return (
    <AuthFrame title="Sign in">
      <SignInForm next={next} />
      <p className="mt-4">
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
    </AuthFrame>
  );
}
