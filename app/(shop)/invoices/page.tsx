import type { Metadata } from "next";
import Link from "next/link";
import { InvoiceList } from "@/components/invoices/invoice-list";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Pager } from "@/components/ui/pager";
import { PageHeader } from "@/components/ui/page-header";
import { readyToInvoice } from "@/db/queries/invoice-pages";
import { listInvoices } from "@/db/queries/invoices";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { decodeCursor, PAGE_SIZE } from "@/lib/http/pagination";
import { PAYMENT_STATE_LABELS, type PaymentState } from "@/lib/invoices/balance";

export const metadata: Metadata = { title: "Invoices" };

const FILTERS: (PaymentState | "all")[] = ["all", "open", "partly_paid", "paid", "void"];

export default async function ShopInvoicesPage({ searchParams }: { searchParams: Promise<{ state?: string; cursor?: string; page?: string }> }) {
  const user = await requirePageRole(CAN.issueInvoices);
  const p = await searchParams;
  const filter = FILTERS.find((f) => f === p.state) ?? "all";
  const cursor = decodeCursor(p.cursor, 1) ? p.cursor : undefined;
  // Open and part paid are both status "open": the query tells them apart, so every page is full.
  const owing = filter === "open" || filter === "partly_paid" ? filter : undefined;
  const status = filter === "paid" || filter === "void" ? filter : undefined;
  const [{ invoices: shown, nextCursor }, ready] = await Promise.all([
    listInvoices(user, { limit: PAGE_SIZE, status, paymentState: owing, cursor }),
    readyToInvoice(user),
  ]);
  return (
    <>
      <PageHeader title="Invoices" kicker="Billing" />
      {ready.length > 0 ? (
        <Card className="mb-4">
          <CardTitle>Ready to invoice</CardTitle>
          <ul className="divide-y divide-rule" data-testid="ready-to-invoice">
            {ready.map((w) => (
              <li key={w.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <Link href={`/work-orders/${w.id}#invoice`} className="font-semibold">
                  {w.label} · {w.unitNumber} · {w.title}
                </Link>
                <span className="text-sm text-ink-faint">
                  {w.accountName}
                  {w.needsPo ? <span className="font-semibold text-rust-deep"> · waiting for a PO number</span> : null}
                </span>
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      <nav aria-label="Filter invoices" className="mb-3 flex flex-wrap gap-2">
        {FILTERS.map((f) => (
          <Link
            key={f}
            href={f === "all" ? "/invoices" : `/invoices?state=${f}`}
            aria-current={f === filter ? "page" : undefined}
            className={`rounded-full border-2 px-3 py-1 text-sm font-semibold no-underline ${f === filter ? "border-ink bg-ink text-paper" : "border-rule-strong"}`}
          >
            {f === "all" ? "All" : PAYMENT_STATE_LABELS[f]}
          </Link>
        ))}
      </nav>
      <Card>
        {shown.length === 0 ? (
          <EmptyState title="No invoices here" />
        ) : (
          <InvoiceList invoices={shown} hrefFor={(id) => `/invoices/${id}`} showAccount timeZone={env().APP_TIME_ZONE} />
        )}
        <Pager base="/invoices" label="Pages of invoices" params={{ state: filter === "all" ? undefined : filter, cursor, page: p.page }} nextCursor={nextCursor} />
      </Card>
    </>
  );
}
