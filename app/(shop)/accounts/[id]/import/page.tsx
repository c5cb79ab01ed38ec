import type { Metadata } from "next";
import { and, eq, isNull } from "drizzle-orm";
import { notFound } from "next/navigation";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { CsvImport } from "@/components/units/csv-import";
import { getDb } from "@/db/client";
import { accounts } from "@/db/schema";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { CSV_FIELDS } from "@/lib/units/csv-import";

export const metadata: Metadata = { title: "Import units" };

export default async function ImportUnitsPage({ params }: { params: Promise<{ id: string }> }) {
  await requirePageRole(CAN.manageAccounts);
  const { id } = await params;
  const [account] = await getDb().select({ id: accounts.id, name: accounts.name }).from(accounts).where(and(eq(accounts.id, id), isNull(accounts.archivedAt))).limit(1);
  if (!account) notFound();
  return (
    <>
      <PageHeader title="Import units from a CSV file" kicker={account.name} />
      <Card>
        <CsvImport accountId={account.id} columns={CSV_FIELDS} />
      </Card>
    </>
  );
}
