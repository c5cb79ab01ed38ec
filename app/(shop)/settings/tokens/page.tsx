import type { Metadata } from "next";
import { ApiTokens } from "@/components/settings/api-tokens";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { listMyTokens } from "@/db/queries/api-tokens";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, isStaff } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "API tokens" };

export default async function TokensPage() {
  const user = await requirePageRole(CAN.anyone);
  const tokens = await listMyTokens(user);
  return (
    <>
      <PageHeader title="Personal API tokens" kicker="For your own scripts, with the Fleet API (/api/v1)">
        <ButtonLink variant="secondary" href={isStaff(user) ? "/settings/tokens/reference" : "/fleet/settings/tokens/reference"}>
          API reference
        </ButtonLink>
      </PageHeader>
      <ApiTokens tokens={tokens} />
    </>
  );
}
