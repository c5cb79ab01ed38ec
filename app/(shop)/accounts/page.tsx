import type { Metadata } from "next";
import Link from "next/link";
import { BudgetBar } from "@/components/accounts/budget-bar";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Money } from "@/components/ui/money";
import { PageHeader } from "@/components/ui/page-header";
import { listAccountsWithBudget } from "@/db/queries/accounts";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Accounts" };

export default async function AccountsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageRole(CAN.manageAccounts);
  const archived = (await searchParams).archived === "1";
  const rows = await listAccountsWithBudget(user, { archived });
  return (
    <>
      <PageHeader title={archived ? "Archived fleet accounts" : "Fleet accounts"} kicker="Limits each fleet has authorised">
        {archived ? null : <ButtonLink href="/accounts/new">New account</ButtonLink>}
        <ButtonLink href={archived ? "/accounts" : "/accounts?archived=1"} variant="secondary">
          {archived ? "Accounts in use" : "Archived"}
        </ButtonLink>
      </PageHeader>
      {rows.length === 0 ? (
        <EmptyState title={archived ? "No archived accounts." : "No fleet accounts yet."}>
          {archived ? null : <Link href="/accounts/new">Create the first one</Link>}
        </EmptyState>
      ) : null}
      <ul className="grid gap-3 md:grid-cols-2">
        {rows.map((a) => (
          <li key={a.id} className="rounded-card border border-rule bg-paper-card p-4">
            <Link href={`/accounts/${a.id}`} className="text-lg font-bold">
              {a.name}
            </Link>
            <p className="text-sm text-ink-soft">
              {a.taxExempt ? `Tax exempt (${a.taxExemptCertificate})` : `Tax ${a.taxRateMilliPct / 1000} %`} · {a.poRequired ? "PO required" : "No PO needed"} · net {a.paymentTermsDays}
            </p>
            <p className="mt-1 text-sm">
              Standing authorisation <Money cents={a.standingAuthorisationCents} /> per work order
            </p>
            <div className="mt-2">
              <BudgetBar usedCents={a.budgetUsedCents} budgetCents={a.repairBudgetCents} label={a.fiscalYear} />
            </div>
          </li>
        ))}
      </ul>
    </>
  );
}
