import type { Metadata } from "next";
import { FleetWatchList } from "@/components/occurrences/fleet-watch-list";
import { PageHeader } from "@/components/ui/page-header";
import { getAccountName } from "@/db/queries/settings";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Occurrence log" };

/** Every fault the shop has asked this account to watch for, one tap from logging it. */
export default async function FleetOccurrencesPage() {
  const user = await requirePageRole(CAN.fleet);
  const accountName = await getAccountName(user.accountId ?? "");
  return (
    <>
      <PageHeader title="Occurrence log" kicker={accountName} />
      <p className="mb-4 max-w-2xl text-ink-soft">
        Some faults never happen in the shop. When one of these happens, log it here straight away: it takes half a minute, and the
        shop sees the pattern.
      </p>
      <FleetWatchList user={user} />
    </>
  );
}
