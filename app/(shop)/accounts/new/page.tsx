import type { Metadata } from "next";
import { AccountForm } from "@/components/accounts/account-form";
import { NEW_ACCOUNT_VALUES } from "@/components/accounts/overrun-shapes";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "New fleet account" };

export default async function NewAccountPage() {
  await requirePageRole(CAN.manageAccounts);
  return (
    <>
      <PageHeader title="New fleet account" kicker="Accounts" />
      <Card>
        <AccountForm initial={NEW_ACCOUNT_VALUES} />
      </Card>
    </>
  );
}
