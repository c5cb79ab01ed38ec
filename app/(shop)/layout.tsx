import { AppShell } from "@/components/shell/app-shell";
import { forbidden } from "next/navigation";
import { getShopSettings } from "@/db/queries/settings";
import { isStaff } from "@/lib/auth/policy";
import { requireUser } from "@/lib/server/auth/current-user";
import { shopNav } from "@/components/shell/nav-items";

export default async function ShopLayout({ children }: { children: React.ReactNode }) {
  const user = await requireUser();
  // Fleet people never see shop pages, whatever URL they type.
  if (!isStaff(user)) forbidden();
  const settings = await getShopSettings();
  return (
    <AppShell home="/floor" orgName={settings.shopName} nav={shopNav(user.role)} user={user} meHref="/me">
      {children}
    </AppShell>
  );
}
