import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccountForm } from "@/components/accounts/account-form";
import { ArchiveAccountButton } from "@/components/accounts/archive-account-button";
import { BudgetBar } from "@/components/accounts/budget-bar";
import { ChangeLog } from "@/components/accounts/change-log";
import { ContactsEditor } from "@/components/accounts/contacts-editor";
import { SigningLimitRow } from "@/components/accounts/signing-limit-row";
import { InviteForm } from "@/components/people/invite-form";
import { PendingInvitations } from "@/components/people/pending-invitations";
import { ButtonLink } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { accountSettingsPage } from "@/db/queries/accounts";
import { pendingInvitations } from "@/db/queries/invitations";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { ROLE_LABELS } from "@/lib/domain";

export const metadata: Metadata = { title: "Account" };

const dollars = (cents: number | null) => (cents === null ? "" : (cents / 100).toFixed(2));

export default async function AccountPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.manageAccounts);
  const { id } = await params;
  const page = await accountSettingsPage(user, id);
  if (!page) notFound();
  const { account: a } = page;
  const canEdit = hasRole(user, CAN.manageAccounts);
  const invites = canEdit ? await pendingInvitations(a.id) : [];
  return (
    <>
      <PageHeader title={a.name} kicker={a.archivedAt ? "Fleet account · archived" : "Fleet account"}>
        <ButtonLink href={`/units?accountId=${a.id}`} variant="secondary">
          Units
        </ButtonLink>
        {canEdit && !a.archivedAt ? (
          <>
            <ButtonLink href={`/units/new?accountId=${a.id}`} variant="secondary">
              Add a unit
            </ButtonLink>
            <ButtonLink href={`/accounts/${a.id}/import`} variant="secondary">
              Import units from CSV
            </ButtonLink>
          </>
        ) : null}
      </PageHeader>
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>Repair budget</CardTitle>
          <BudgetBar usedCents={page.budgetUsedCents} budgetCents={a.repairBudgetCents} label={page.fiscalYear} />
        </Card>
        {canEdit ? (
          <Card>
            <AccountForm
              initial={{
                accountId: a.id,
                name: a.name,
                billingEmail: a.billingEmail,
                address: a.address,
                phone: a.phone,
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
          <p className="text-ink-soft">Only the owner and service writers change accounts.</p>
        )}
        <Card>
          <CardTitle>Contacts</CardTitle>
          {canEdit ? (
            <ContactsEditor accountId={a.id} initial={page.contacts.map((c) => ({ name: c.name, role: c.title, email: c.email, phone: c.phone, billing: c.isBilling }))} />
          ) : (
            <ul className="divide-y divide-rule">
              {page.contacts.map((c) => (
                <li key={c.id} className="py-2">
                  <p className="font-semibold">{c.name}</p>
                  <p className="text-sm text-ink-faint">{[c.title, c.email, c.phone].filter(Boolean).join(" · ")}</p>
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card>
          <CardTitle>People who sign in, and signing limits</CardTitle>
          {page.people.length === 0 ? <p className="text-ink-faint">Nobody from this fleet signs in yet.</p> : null}
          {page.people.map((p) =>
            p.role === "approver" && canEdit ? (
              <SigningLimitRow key={p.id} userId={p.id} name={p.name} email={p.email} limit={dollars(p.signingLimitCents)} />
            ) : (
              <div key={p.id} className="border-t border-rule py-2">
                <p className="font-semibold">
                  {p.name} <span className="text-sm font-normal text-ink-faint">· {ROLE_LABELS[p.role]}{p.active ? "" : " · sign-in turned off"}</span>
                </p>
                <p className="text-sm text-ink-faint">{p.email}</p>
              </div>
            ),
          )}
          {canEdit && !a.archivedAt ? (
            <div className="mt-4 border-t-2 border-rule pt-3">
              <h3 className="mb-2 font-bold">Invite someone from {a.name}</h3>
              <InviteForm accountId={a.id} />
              <h3 className="mt-4 mb-2 font-bold">Invitations waiting</h3>
              <PendingInvitations rows={invites} now={new Date().toISOString()} />
            </div>
          ) : null}
          {user.role === "owner" ? (
            <p className="mt-3 text-sm">
              <Link href="/settings/people">Change names and roles, or turn sign-in off, on the People page.</Link>
            </p>
          ) : null}
        </Card>
        <Card>
          <CardTitle>Change log</CardTitle>
          <ChangeLog entries={page.changes} />
        </Card>
        {canEdit ? (
          <Card>
            <CardTitle>{a.archivedAt ? "Archived" : "Archive"}</CardTitle>
            <p className="mb-2 text-sm text-ink-soft">
              An archived account keeps its visits, invoices and change log, leaves every list, and cannot check units in.
            </p>
            <ArchiveAccountButton accountId={a.id} archived={a.archivedAt !== null} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
