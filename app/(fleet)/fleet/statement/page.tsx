import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PrintButton } from "@/components/invoices/print-button";
import { StatementView } from "@/components/invoices/statement-view";
import { PageHeader } from "@/components/ui/page-header";
import { accountStatement } from "@/db/queries/statement";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Statement" };

export default async function FleetStatementPage() {
  const user = await requirePageRole(CAN.readOwnStatement);
  if (!user.accountId) notFound();
  const statement = await accountStatement(user, user.accountId, {});
  if (!statement) notFound();
  return (
    <>
      <PageHeader title="Statement" kicker={statement.accountName}>
        <span className="no-print">
          <PrintButton />
        </span>
      </PageHeader>
      <StatementView statement={statement} hrefFor={(id) => `/fleet/invoices/${id}`} />
    </>
  );
}
