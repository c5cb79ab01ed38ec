import type { Metadata } from "next";
import { AuthFrame } from "@/components/auth/auth-frame";
import { LinkRefusal } from "@/components/auth/link-refusal";
import { NewPasswordForm } from "@/components/auth/new-password-form";
import { invitationForToken } from "@/db/queries/invitations";
import { looksLikeLinkToken } from "@/lib/auth/tokens";
import { ROLE_LABELS } from "@/lib/domain";

export const metadata: Metadata = { title: "Your invitation", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

/** Opened from an invitation e-mail: the person chooses their own password. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = looksLikeLinkToken(token) ? await invitationForToken(token) : null;
  if (!invitation) {
    return (
      <AuthFrame title="Your invitation">
        <LinkRefusal state="invalid" next="Ask whoever invited you to send the invitation again." />
      </AuthFrame>
    );
  }
  if (invitation.state !== "usable") {
    return (
      <AuthFrame title="Your invitation">
        <LinkRefusal state={invitation.state} next={invitation.state === "used" ? "Forgot it? Ask for a reset link." : "Ask whoever invited you to send it again."} />
      </AuthFrame>
    );
  }
  return (
    <AuthFrame title={`Welcome, ${invitation.name}`}>
      <p className="mb-4">
        You are invited as <strong>{ROLE_LABELS[invitation.role]}</strong>
        {invitation.accountName ? ` for ${invitation.accountName}` : ""}. You will sign in as <strong>{invitation.email}</strong>.
      </p>
      <NewPasswordForm token={token} purpose="invitation" />
    </AuthFrame>
  );
}
