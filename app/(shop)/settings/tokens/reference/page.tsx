import type { Metadata } from "next";
import { ReferencePage } from "@/components/api-reference/reference-page";
import { CAN } from "@/lib/auth/policy";
import { requirePageRole } from "@/lib/server/auth/page-access";

export const metadata: Metadata = { title: "Fleet API reference" };

/**
 * The shop's copy of the reference, beside its API tokens page. The guard names
 * the shop's roles (the tokens page's CAN.anyone, less the fleet people the
 * shop layout refuses): Next renders a page beside its layout, so the page
 * itself must refuse before the reference reaches the response.
 */
export default async function ShopApiReferencePage() {
  await requirePageRole(CAN.shopStaff);
  return <ReferencePage tokensHref="/settings/tokens" />;
}
