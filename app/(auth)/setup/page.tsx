import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { AuthFrame } from "@/components/auth/auth-frame";
import { SetupForm } from "@/components/auth/setup-form";
import { needsSetup } from "@/db/queries/setup";

export const metadata: Metadata = { title: "Set up Cotter" };
export const dynamic = "force-dynamic";

/** First run only: on a database with nobody in it. Once the owner exists this page is gone for good. */
export default async function SetupPage() {
  if (!(await needsSetup())) notFound();
  return (
    <AuthFrame
      title="Set up your shop"
      intro={
        <>
          <p>This Cotter has no shop yet. Tell it about yours and make the owner&apos;s sign-in; then invite your writers and technicians, add your fleet accounts and their units, and check the first truck in.</p>
          <p className="mt-3 text-base">This page works once. Readings and verdicts in Cotter support the technician&apos;s judgement; the maker&apos;s procedure, local codes and licensed inspectors decide.</p>
        </>
      }
    >
      <SetupForm />
    </AuthFrame>
  );
}
