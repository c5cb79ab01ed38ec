import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FleetOccurrenceLog } from "@/components/occurrences/fleet-occurrence-log";
import { PageHeader } from "@/components/ui/page-header";
import { Pager } from "@/components/ui/pager";
import { listOccurrences } from "@/db/queries/occurrences";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { decodeCursor, PAGE_SIZE } from "@/lib/http/pagination";
import { HttpError } from "@/lib/http/problem";

export const metadata: Metadata = { title: "Log an occurrence" };

/** Phone-first: a driver or foreman records the fault the moment it happens. */
export default async function FleetOccurrenceLogPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ cursor?: string; page?: string }>;
}) {
  const user = await requirePageRole(CAN.fleet);
  const { id } = await params;
  const sp = await searchParams;
  const page = { limit: PAGE_SIZE, cursor: decodeCursor(sp.cursor, 2) ? sp.cursor : undefined };
  // Scoped to the user's account: another account's unit is simply not found.
  const log = await listOccurrences(user, id, page).catch((error: unknown) => {
    if (error instanceof HttpError && error.status === 404) return null;
    throw error;
  });
  if (!log) notFound();
  return (
    <>
      <PageHeader title={`Unit ${log.unit.unitNumber}`} kicker="Occurrence log">
        <Link href={`/fleet/units/${id}`} className="flex min-h-touch items-center">
          Unit page
        </Link>
      </PageHeader>
      <div className="mx-auto max-w-2xl">
        <FleetOccurrenceLog
          unitId={id}
          initial={log}
          meId={user.id}
          page={page}
          pager={<Pager base={`/fleet/units/${id}/log`} label="Pages of the log" params={{ cursor: page.cursor, page: sp.page }} nextCursor={log.nextCursor} hash="#log-title" />}
        />
      </div>
    </>
  );
}
