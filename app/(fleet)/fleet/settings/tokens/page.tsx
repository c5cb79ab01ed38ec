import type { Metadata } from "next";
import { TokensPage } from "@/components/settings/tokens-page";
import { CAN } from "@/lib/auth/policy";
import { requirePageRole } from "@/lib/server/auth/page-access";

export const metadata: Metadata = { title: "API tokens" };

/** A fleet person's own tokens, inside the fleet portal's frame. */
export default async function FleetTokensPage() {
  const user = await requirePageRole(CAN.fleet);
  return <TokensPage user={user} referenceHref="/fleet/settings/tokens/reference" />;
}
