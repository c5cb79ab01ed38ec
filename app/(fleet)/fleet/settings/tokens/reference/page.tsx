import type { Metadata } from "next";
import { ReferencePage } from "@/components/api-reference/reference-page";
import { CAN } from "@/lib/auth/policy";
import { requirePageRole } from "@/lib/server/auth/page-access";

export const metadata: Metadata = { title: "Fleet API reference" };

/** The fleet portal's copy of the reference, beside its API tokens page; fleet people only (the portal's layout sends staff to the floor). */
export default async function FleetApiReferencePage() {
  await requirePageRole(CAN.fleet);
  return <ReferencePage tokensHref="/fleet/settings/tokens" />;
}
