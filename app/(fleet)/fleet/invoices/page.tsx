import type { Metadata } from "next";
import { InvoiceList } from "@/components/invoices/invoice-list";
import { PoNumberForm } from "@/components/invoices/po-number-form";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Money } from "@/components/ui/money";
import { Pager } from "@/components/ui/pager";
import { PageHeader } from "@/components/ui/page-header";
import { waitingForPo } from "@/db/queries/invoice-pages";
import { listInvoices, openInvoices } from "@/db/queries/invoices";
import { getAccountName } from "@/db/queries/settings";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { decodeCursor, PAGE_SIZE } from "@/lib/http/pagination";

export const metadata: Metadata = { title: "Invoices" };

export default async function FleetInvoicesPage({ searchParams }: { searchParams: Promise<{ cursor?: string; page?: string }> }) {
  const user = await requirePageRole(CAN.pay);
  const p = await searchParams;
  const cursor = decodeCursor(p.cursor, 1) ? p.cursor : undefined;
  // What is owed is every open invoice with a balance (bounded by what is unpaid, not by
  // history); the paid and void ones are a paged list, newest first.
  const [owing, { invoices: settled, nextCursor }, needPo, accountName] = await Promise.all([
    openInvoices(user.accountId ?? ""),
    listInvoices(user, { limit: PAGE_SIZE, settled: true, cursor }),
    hasRole(user, CAN.enterPoNumber) ? waitingForPo(user) : Promise.resolve([]),
    getAccountName(user.accountId ?? ""),
  ]);
  const due = owing.reduce((s, i) => s + i.balanceCents, 0);
  const timeZone = env().APP_TIME_ZONE;
  return (
    <>
      <PageHeader title="Invoices" kicker={accountName}>
        <p className="text-right">
          <span className="block text-sm text-ink-faint">Open balance</span>
          <Money cents={due} className="text-2xl font-bold" />
        </p>
      </PageHeader>
      <div className="flex flex-col gap-4">
        {needPo.length > 0 ? (
          <Card className="border-2 border-rust" data-testid="waiting-for-po">
            <CardTitle>Waiting for your PO number</CardTitle>
            <p className="mb-2 text-sm text-ink-soft">The shop cannot invoice these visits until they carry a PO number.</p>
            <ul className="flex flex-col gap-3">
              {needPo.map((w) => (
                <li key={w.id}>
                  <p className="font-semibold">
                    {w.label} · Unit {w.unitNumber} · {w.title}
                  </p>
                  <PoNumberForm workOrderId={w.id} label={w.label} />
                </li>
              ))}
            </ul>
          </Card>
        ) : null}
        <Card>
          <CardTitle>To pay</CardTitle>
          {owing.length === 0 ? (
            <EmptyState title="Nothing to pay">Every invoice is paid.</EmptyState>
          ) : (
            <InvoiceList invoices={owing} hrefFor={(id) => `/fleet/invoices/${id}`} timeZone={timeZone} />
          )}
        </Card>
        <Card aria-labelledby="settled-title">
          <CardTitle id="settled-title">Paid and void</CardTitle>
          {settled.length === 0 ? (
            <p className="text-ink-faint">None yet.</p>
          ) : (
            <InvoiceList invoices={settled} hrefFor={(id) => `/fleet/invoices/${id}`} timeZone={timeZone} />
          )}
          <Pager base="/fleet/invoices" label="Pages of paid and void invoices" params={{ cursor, page: p.page }} nextCursor={nextCursor} hash="#settled-title" />
        </Card>
      </div>
    </>
  );
}
