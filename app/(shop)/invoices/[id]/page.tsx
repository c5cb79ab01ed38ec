import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CreditNoteForm } from "@/components/invoices/credit-note-form";
import { HeldPaymentActions } from "@/components/invoices/held-payment-actions";
import { InvoiceDocument } from "@/components/invoices/invoice-document";
import { PrintButton } from "@/components/invoices/print-button";
import { RecordPaymentForm } from "@/components/invoices/record-payment-form";
import { VoidInvoiceForm } from "@/components/invoices/void-invoice-form";
import { buttonClass } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Money } from "@/components/ui/money";
import { getInvoiceDetail } from "@/db/queries/invoices";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";

export const metadata: Metadata = { title: "Invoice" };

export default async function ShopInvoicePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.issueInvoices);
  const { id } = await params;
  const inv = await getInvoiceDetail(user, id);
  if (!inv) notFound();
  const timeZone = env().APP_TIME_ZONE;
  const held = inv.payments.filter((p) => p.flagged && p.resolution === null);
  const open = inv.status === "open" && inv.balanceCents > 0;
  return (
    <div className="grid gap-4 lg:grid-cols-[3fr_1fr] print:block">
      <div className="flex flex-col gap-3">
        <p className="no-print text-sm">
          <Link href={`/work-orders/${inv.workOrderId}`}>{inv.workOrderNumber}</Link> · <Link href={`/receivables/${inv.accountId}`}>{inv.accountName} statement</Link>
          {inv.replaces ? (
            <>
              {" "}
              · replaces <Link href={`/invoices/${inv.replaces.id}`}>{inv.replaces.label}</Link>
            </>
          ) : null}
          {inv.replacedBy ? (
            <>
              {" "}
              · replaced by <Link href={`/invoices/${inv.replacedBy.id}`}>{inv.replacedBy.label}</Link>
            </>
          ) : null}
        </p>
        {held.map((p) => (
          <Card key={p.id} className="no-print border-2 border-rust" data-testid="held-payment">
            <CardTitle>Card payment held for review</CardTitle>
            <p className="mb-2">
              <Money cents={p.amountCents} className="font-bold" /> by card. {p.flagReason}
            </p>
            <HeldPaymentActions paymentId={p.id} canApply={inv.status !== "void"} />
          </Card>
        ))}
        <InvoiceDocument invoice={inv} timeZone={timeZone} />
      </div>
      <aside className="no-print flex flex-col gap-4">
        <Card>
          <CardTitle>Copies</CardTitle>
          <div className="flex flex-wrap gap-2">
            <PrintButton />
            <a href={`/api/v1/invoices/${inv.id}/pdf`} className={buttonClass("secondary", "no-underline")} download>
              PDF
            </a>
          </div>
        </Card>
        {open ? (
          <Card>
            <CardTitle>Record a payment</CardTitle>
            <RecordPaymentForm invoiceId={inv.id} balanceCents={inv.balanceCents} today={calendarDate(new Date(), timeZone)} />
          </Card>
        ) : null}
        {inv.status === "open" && inv.payments.length === 0 && inv.creditNotes.length === 0 ? (
          <Card>
            <CardTitle>Correct it</CardTitle>
            <VoidInvoiceForm invoiceId={inv.id} label={inv.label} />
          </Card>
        ) : null}
        {open ? (
          <Card>
            <CardTitle>Credit part of it</CardTitle>
            <CreditNoteForm invoiceId={inv.id} balanceCents={inv.balanceCents} />
          </Card>
        ) : null}
      </aside>
    </div>
  );
}
