import type { Metadata } from "next";
import { asc } from "drizzle-orm";
import { AddPersonForm } from "@/components/settings/add-person-form";
import { PersonActiveButton } from "@/components/settings/person-active-button";
import { Card, CardTitle } from "@/components/ui/card";
import { Money } from "@/components/ui/money";
import { PageHeader } from "@/components/ui/page-header";
import { getDb } from "@/db/client";
import { listPeople } from "@/db/queries/people";
import { scopedTo } from "@/db/queries/scope";
import { accounts } from "@/db/schema";
import { requirePageRole } from "@/lib/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { ROLE_LABELS } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const user = await requirePageRole(CAN.manageShop);
  const [people, accountRows] = await Promise.all([listPeople(user), getDb().select({ id: accounts.id, name: accounts.name }).from(accounts).where(scopedTo(accounts.id, user)).orderBy(asc(accounts.name))]);
  return (
    <>
      <PageHeader title="People who sign in" kicker="Owner only" />
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>Add someone</CardTitle>
          <AddPersonForm accounts={accountRows} />
        </Card>
        <Card>
          <ul className="divide-y divide-rule">
            {people.map((p) => (
              <li key={p.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <div>
                  <p className="font-semibold">
                    {p.name} <span className="text-sm font-normal text-ink-faint">· {ROLE_LABELS[p.role]} · {p.accountName ?? "Quarry Road staff"}</span>
                  </p>
                  <p className="text-sm text-ink-faint">
                    {p.email}
                    {p.signingLimitCents !== null ? (
                      <>
                        {" "}
                        · signing limit <Money cents={p.signingLimitCents} />
                      </>
                    ) : null}
                    {p.lastSignInAt ? ` · last signed in ${formatDateTime(p.lastSignInAt)}` : " · never signed in"}
                    {p.active ? "" : " · sign-in turned off"}
                  </p>
                </div>
                {p.id === user.id ? null : <PersonActiveButton userId={p.id} active={p.active} />}
              </li>
            ))}
          </ul>
        </Card>
      </div>
    </>
  );
}
