import Link from "next/link";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import type { SessionUser } from "@/lib/auth/session-user";
import { ROLE_LABELS } from "@/lib/domain";
import { ChangePasswordForm } from "./change-password-form";

/** Your own sign-in, on either side: who you are, your password, your API tokens. */
export function MySignIn({ user, tokensHref }: { user: SessionUser; tokensHref: string }) {
  return (
    <>
      <PageHeader title="Your sign-in" kicker={ROLE_LABELS[user.role]} />
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>{user.name}</CardTitle>
          <p>
            You sign in as <strong>{user.email}</strong>. <Link href={tokensHref}>Personal API tokens</Link> for scripts act with your role.
          </p>
        </Card>
        <Card>
          <CardTitle>Change your password</CardTitle>
          <ChangePasswordForm />
        </Card>
      </div>
    </>
  );
}
