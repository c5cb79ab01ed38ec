import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PrintButton } from "@/components/invoices/print-button";
import { StatementView } from "@/components/invoices/statement-view";
import { PageHeader } from "@/components/ui/page-header";
import { accountStatement } from "@/db/queries/statement";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Account statement" };

export default async function ShopStatementPage({ params }: { params: Promise<{ accountId: string }> }) {
  const user = await requirePageRole(CAN.issueInvoices);
  const { accountId } = await params;
  const statement = await accountStatement(user, accountId, {});
  if (!statement) notFound();
  return (
    <>
      <PageHeader title="Statement" kicker={statement.accountName}>
        <span className="no-print">
          <PrintButton />
        </span>
      </PageHeader>
      <StatementView statement={statement} hrefFor={(id) => `/invoices/${id}`} />
    </>
  );
}
