import type { Metadata } from "next";
import { TokensPage } from "@/components/settings/tokens-page";
import { CAN } from "@/lib/auth/policy";
import { requirePageRole } from "@/lib/server/auth/page-access";

export const metadata: Metadata = { title: "API tokens" };

/**
 * The shop's people's tokens. The guard names the shop's roles, not everyone:
 * Next renders a page beside its layout, so a fleet person refused by the shop
 * layout would otherwise get their token list inside the 403 (they have their own page).
 */
export default async function ShopTokensPage() {
  const user = await requirePageRole(CAN.shopStaff);
  return <TokensPage user={user} referenceHref="/settings/tokens/reference" />;
}
