import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { CotterMark } from "@/components/shell/app-shell";
import { currentUser } from "@/lib/auth/current-user";
import { safeNextPath } from "@/lib/http/safe-next";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const params = await searchParams;
  const next = safeNextPath(params.callbackUrl ?? params.next);
  if (await currentUser()) redirect(next);
  return (
    <main className="mx-auto grid min-h-dvh max-w-4xl items-center gap-8 px-5 py-10 md:grid-cols-2">
      <div>
        <div className="mb-4 flex items-center gap-3">
          <CotterMark size={44} />
          <span className="text-4xl font-bold tracking-tight">Cotter</span>
        </div>
        <p className="text-lg text-ink-soft">
          Where the shop and the fleet agree on the work: live unit status, what the technician found, and an estimate
          you decide line by line.
        </p>
      </div>
      <div className="rounded-card border border-rule bg-paper-card p-6 shadow-[0_2px_0_#d8cdb9]">
        <h1 className="mb-4 text-2xl font-bold">Sign in</h1>
        <SignInForm next={next} />
      </div>
    </main>
  );
}
