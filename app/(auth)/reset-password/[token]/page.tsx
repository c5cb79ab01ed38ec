import type { Metadata } from "next";
import { AuthFrame } from "@/components/auth/auth-frame";
import { LinkRefusal } from "@/components/auth/link-refusal";
import { NewPasswordForm } from "@/components/auth/new-password-form";
import { resetStateForToken } from "@/db/queries/passwords";
import { looksLikeLinkToken } from "@/lib/auth/tokens";

export const metadata: Metadata = { title: "Choose a new password", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const reset = looksLikeLinkToken(token) ? await resetStateForToken(token) : null;
  const again = "Ask for a new link: they last an hour and work once.";
  if (!reset) {
    return (
      <AuthFrame title="Choose a new password">
        <LinkRefusal state="invalid" next={again} />
      </AuthFrame>
    );
  }
  if (reset.state !== "usable") {
    return (
      <AuthFrame title="Choose a new password">
        <LinkRefusal state={reset.state === "used" ? "used" : "expired"} next={again} />
      </AuthFrame>
    );
  }
  return (
    <AuthFrame title="Choose a new password">
      <p className="mb-4">
        For <strong>{reset.email}</strong>. Saving it signs you out everywhere else.
      </p>
      <NewPasswordForm token={token} purpose="reset" />
    </AuthFrame>
  );
}
