import type { Metadata } from "next";
import { and, asc, isNull } from "drizzle-orm";
import { InviteForm } from "@/components/people/invite-form";
import { PendingInvitations } from "@/components/people/pending-invitations";
import { PersonRow } from "@/components/people/person-row";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { getDb } from "@/db/client";
import { pendingInvitations } from "@/db/queries/invitations";
import { listPeople } from "@/db/queries/people";
import { scopedTo } from "@/db/queries/scope";
import { getShopSettings } from "@/db/queries/settings";
import { accounts } from "@/db/schema";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { formatDateTime } from "@/lib/format";

export const metadata: Metadata = { title: "People" };

const dollars = (cents: number | null) => (cents === null ? "" : (cents / 100).toFixed(2));

export default async function PeoplePage() {
  const user = await requirePageRole(CAN.manageShop);
  const [people, invites, accountRows, shop] = await Promise.all([
    listPeople(user),
    pendingInvitations(),
    getDb().select({ id: accounts.id, name: accounts.name }).from(accounts).where(and(scopedTo(accounts.id, user), isNull(accounts.archivedAt))).orderBy(asc(accounts.name)),
    getShopSettings(),
  ]);
  return (
    <>
      <PageHeader title="People who sign in" kicker="Owner only" />
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>Invite someone</CardTitle>
          <p className="mb-3 text-sm text-ink-soft">They get an e-mail with a link that works once, for seven days, to choose their own password. Nobody else ever knows it.</p>
          <InviteForm accounts={accountRows} />
        </Card>
        <Card>
          <CardTitle>Invitations waiting</CardTitle>
          <PendingInvitations rows={invites} now={new Date().toISOString()} />
        </Card>
        <Card>
          <CardTitle>Everyone who signs in</CardTitle>
          <ul className="divide-y divide-rule">
            {people.map((p) => (
              <PersonRow
                key={p.id}
                isSelf={p.id === user.id}
                shopName={`${shop.shopName} staff`}
                person={{
                  id: p.id,
                  name: p.name,
                  email: p.email,
                  role: p.role,
                  accountName: p.accountName,
                  signingLimit: dollars(p.signingLimitCents),
                  active: p.active,
                  lastSeen: p.lastSignInAt ? `last signed in ${formatDateTime(p.lastSignInAt)}` : "never signed in",
                }}
              />
            ))}
          </ul>
        </Card>
      </div>
    </>
  );
}
