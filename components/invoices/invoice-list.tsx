import Link from "next/link";
import { Money } from "@/components/ui/money";
import type { InvoiceListItem } from "@/db/queries/invoices";
import { formatDate } from "@/lib/format";
import { PaymentStatePill } from "./payment-state-pill";

/** Invoices as rows on a desktop and as cards on a phone. */
export function InvoiceList({
  invoices,
  hrefFor,
  showAccount = false,
  timeZone,
}: {
  invoices: InvoiceListItem[];
  hrefFor: (id: string) => string;
  showAccount?: boolean;
  timeZone: string;
}) {
  return (
    <>
      <ul className="divide-y divide-rule md:hidden" data-testid="invoice-cards">
        {invoices.map((i) => (
          <li key={i.id} data-testid="invoice-row">
            <Link href={hrefFor(i.id)} className="flex min-h-touch items-center justify-between gap-3 py-3 no-underline">
              <span>
                <span className="block font-bold">
                  {i.label} · Unit {i.unitNumber}
                </span>
                <span className="block text-sm text-ink-faint">
                  {showAccount ? `${i.accountName} · ` : ""}Due {formatDate(i.dueAt)}
                  {i.poNumber ? ` · PO ${i.poNumber}` : ""}
                </span>
              </span>
              <span className="flex flex-col items-end gap-1">
                {/* What is owed on an open invoice; what it was for a settled one. */}
                <Money
                  cents={i.paymentState === "open" || i.paymentState === "partly_paid" ? i.balanceCents : i.totalCents}
                  className={`font-bold ${i.status === "void" ? "text-ink-faint line-through decoration-1" : ""}`}
                />
                <PaymentStatePill state={i.paymentState} size="sm" />
              </span>
            </Link>
          </li>
        ))}
      </ul>
      <table className="hidden w-full text-sm md:table">
        <thead>
          <tr className="border-b-2 border-ink text-left text-xs tracking-wide text-ink-faint uppercase">
            <th className="py-1 pr-2">Invoice</th>
            {showAccount ? <th className="py-1 pr-2">Account</th> : null}
            <th className="py-1 pr-2">Unit · visit</th>
            <th className="py-1 pr-2">PO</th>
            <th className="py-1 pr-2">Issued</th>
            <th className="py-1 pr-2">Due</th>
            <th className="py-1 pr-2 text-right">Total</th>
            <th className="py-1 pr-2 text-right">Balance</th>
            <th className="py-1">Status</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {invoices.map((i) => (
            <tr key={i.id} data-testid="invoice-row">
              <td className="py-2 pr-2 font-bold">
                <Link href={hrefFor(i.id)}>{i.label}</Link>
              </td>
              {showAccount ? <td className="py-2 pr-2">{i.accountName}</td> : null}
              <td className="py-2 pr-2">
                {i.unitNumber} · {i.workOrderNumber}
              </td>
              <td className="py-2 pr-2">{i.poNumber ?? "—"}</td>
              <td className="py-2 pr-2 whitespace-nowrap">{formatDate(i.issuedAt, timeZone)}</td>
              <td className="py-2 pr-2 whitespace-nowrap">{formatDate(i.dueAt)}</td>
              <td className="py-2 pr-2 text-right">
                <Money cents={i.totalCents} />
              </td>
              <td className="py-2 pr-2 text-right font-semibold">
                <Money cents={i.balanceCents} />
              </td>
              <td className="py-2">
                <PaymentStatePill state={i.paymentState} size="sm" />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
