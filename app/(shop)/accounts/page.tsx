import type { Metadata } from "next";
import Link from "next/link";
import { BudgetBar } from "@/components/accounts/budget-bar";
import { Money } from "@/components/ui/money";
import { PageHeader } from "@/components/ui/page-header";
import { listAccountsWithBudget } from "@/db/queries/accounts";
import { requirePageRole } from "@/lib/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Accounts" };

export default async function AccountsPage() {
  const user = await requirePageRole(CAN.manageAccounts);
  const rows = await listAccountsWithBudget(user);
  return (
    <>
      <PageHeader title="Fleet accounts" kicker="Limits each fleet has authorised" />
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
