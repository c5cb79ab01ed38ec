import type { Metadata } from "next";
import { ApiTokens } from "@/components/settings/api-tokens";
import { PageHeader } from "@/components/ui/page-header";
import { listMyTokens } from "@/db/queries/api-tokens";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "API tokens" };

export default async function TokensPage() {
  const user = await requirePageRole(CAN.anyone);
  const tokens = await listMyTokens(user);
  return (
    <>
      <PageHeader title="Personal API tokens" kicker="For your own scripts, with the Fleet API (/api/v1)" />
      <ApiTokens tokens={tokens} />
    </>
  );
}
