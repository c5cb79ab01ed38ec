import { redirect } from "next/navigation";
import { AppShell } from "@/components/shell/app-shell";
import { fleetNav } from "@/components/shell/nav-items";
import { getAccountName } from "@/db/queries/settings";
import { isStaff } from "@/lib/auth/policy";
import { requireUser } from "@/lib/server/auth/current-user";

export default async function FleetLayout({ children }: { children: React.ReactNode }) {
  const user = await requireUser();
  // Shop staff work from the Floor; the fleet portal is one account's view.
  if (isStaff(user) || !user.accountId) redirect("/floor");
  const accountName = await getAccountName(user.accountId);
  return (
    <AppShell home="/fleet" orgName={accountName} nav={fleetNav(user.role)} user={user} meHref="/fleet/me">
      {children}
    </AppShell>
  );
}
