import type { Metadata } from "next";
import { MySignIn } from "@/components/people/my-sign-in";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Your sign-in" };

export default async function FleetMePage() {
  const user = await requirePageRole(CAN.fleet);
  return <MySignIn user={user} tokensHref="/fleet/settings/tokens" />;
}
