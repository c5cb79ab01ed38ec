import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { AccountSettingsForm } from "@/components/accounts/account-settings-form";
import { BudgetBar } from "@/components/accounts/budget-bar";
import { SigningLimitRow } from "@/components/accounts/signing-limit-row";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { accountSettingsPage } from "@/db/queries/accounts";
import { requirePageRole } from "@/lib/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { ROLE_LABELS } from "@/lib/domain";
import { describeChange } from "@/lib/audit-format";
import { formatDateTime } from "@/lib/format";

export const metadata: Metadata = { title: "Account settings" };

const dollars = (cents: number | null) => (cents === null ? "" : (cents / 100).toFixed(2));

export default async function AccountPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.manageAccounts);
  const { id } = await params;
  const page = await accountSettingsPage(user, id);
  if (!page) notFound();
  const { account: a } = page;
  const canEdit = hasRole(user, CAN.manageAccounts);
  return (
    <>
      <PageHeader title={a.name} kicker="Fleet account" />
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>Repair budget</CardTitle>
          <BudgetBar usedCents={page.budgetUsedCents} budgetCents={a.repairBudgetCents} label={page.fiscalYear} />
        </Card>
        {canEdit ? (
          <Card>
            <AccountSettingsForm
              initial={{
                accountId: a.id,
                standingAuthorisation: dollars(a.standingAuthorisationCents),
                repairBudget: dollars(a.repairBudgetCents),
                fiscalYearStartMonth: a.fiscalYearStartMonth,
                overrunPercent: String(a.overrunPercentMilli / 1000),
                overrunCap: dollars(a.overrunCapCents),
                overrunFloor: dollars(a.overrunFloorCents),
                taxExempt: a.taxExempt,
                taxExemptCertificate: a.taxExemptCertificate ?? "",
                taxRate: String(a.taxRateMilliPct / 1000),
                poRequired: a.poRequired,
                paymentTermsDays: a.paymentTermsDays,
                shopSuppliesExempt: a.shopSuppliesExempt,
              }}
            />
          </Card>
        ) : (
          <p className="text-ink-soft">Only the owner and service writers change account limits.</p>
        )}
        <Card>
          <CardTitle>People and signing limits</CardTitle>
          {page.people.map((p) =>
            p.role === "approver" && canEdit ? (
              <SigningLimitRow key={p.id} userId={p.id} name={p.name} email={p.email} limit={dollars(p.signingLimitCents)} />
            ) : (
              <div key={p.id} className="border-t border-rule py-2">
                <p className="font-semibold">
                  {p.name} <span className="text-sm font-normal text-ink-faint">· {ROLE_LABELS[p.role]}</span>
                </p>
                <p className="text-sm text-ink-faint">{p.email}</p>
              </div>
            ),
          )}
        </Card>
        <Card>
          <CardTitle>Change log</CardTitle>
          {page.changes.length === 0 ? <p className="text-sm text-ink-faint">No changes yet.</p> : null}
          <ul className="divide-y divide-rule text-sm">
            {page.changes.map((c, i) => (
              <li key={i} className="py-2">
                <p>
                  <span className="font-semibold">{formatDateTime(c.at)}</span> · {c.actor}
                </p>
                <ul className="mt-1 text-ink-soft">
                  {describeChange(c.detail).map((line) => (
                    <li key={line}>{line}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        </Card>
      </div>
    </>
  );
}
