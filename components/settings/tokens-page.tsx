import { ApiTokens } from "@/components/settings/api-tokens";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { listMyTokens } from "@/db/queries/api-tokens";
import type { SessionUser } from "@/lib/auth/session-user";

/** A person's own API tokens, with the link to the reference on the same side of the app. */
export async function TokensPage({ user, referenceHref }: { user: SessionUser; referenceHref: string }) {
  const tokens = await listMyTokens(user);
  return (
    <>
      <PageHeader title="Personal API tokens" kicker="For your own scripts, with the Fleet API (/api/v1)">
        <ButtonLink variant="secondary" href={referenceHref}>
          API reference
        </ButtonLink>
      </PageHeader>
      <ApiTokens tokens={tokens} />
    </>
  );
}
