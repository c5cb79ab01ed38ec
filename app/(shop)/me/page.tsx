import type { Metadata } from "next";
import { MySignIn } from "@/components/people/my-sign-in";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Your sign-in" };

export default async function ShopMePage() {
  const user = await requirePageRole(CAN.shopStaff);
  return <MySignIn user={user} tokensHref="/settings/tokens" />;
}
