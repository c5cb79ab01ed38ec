import type { Metadata } from "next";
import Link from "next/link";
import { AgeingSummary } from "@/components/invoices/ageing-summary";
import { Card, CardTitle } from "@/components/ui/card";
import { Money } from "@/components/ui/money";
import { PageHeader } from "@/components/ui/page-header";
import { receivables } from "@/db/queries/statement";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { formatDate } from "@/lib/format";
import { AGEING_BUCKETS, AGEING_LABELS } from "@/lib/receivables/ageing";

export const metadata: Metadata = { title: "Receivables" };

export default async function ReceivablesPage() {
  const user = await requirePageRole(CAN.issueInvoices);
  const r = await receivables(user);
  return (
    <>
      <PageHeader title="Receivables" kicker={`Owed to the shop as of ${formatDate(r.asOf)}`} />
      <div className="flex flex-col gap-4">
        {r.heldPayments.length > 0 ? (
          <Card className="border-2 border-rust" data-testid="held-payments">
            <CardTitle>Card payments held for review</CardTitle>
            <ul className="divide-y divide-rule">
              {r.heldPayments.map((p) => (
                <li key={p.id} className="py-2">
                  <Link href={`/invoices/${p.invoiceId}`} className="font-bold">
                    {p.invoiceLabel}
                  </Link>{" "}
                  · {p.accountName} · <Money cents={p.amountCents} />
                  <p className="text-sm text-ink-soft">{p.flagReason}</p>
                </li>
              ))}
            </ul>
          </Card>
        ) : null}
        <Card>
          <CardTitle>All accounts</CardTitle>
          <AgeingSummary ageing={r.ageing} totalDueCents={r.totalDueCents} />
        </Card>
        <Card>
          <CardTitle>By account</CardTitle>
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="receivables-table">
              <thead>
                <tr className="border-b-2 border-ink text-left text-xs tracking-wide text-ink-faint uppercase">
                  <th className="py-1 pr-2">Account</th>
                  {AGEING_BUCKETS.map((b) => (
                    <th key={b} className="py-1 pr-2 text-right">
                      {AGEING_LABELS[b]}
                    </th>
                  ))}
                  <th className="py-1 text-right">Total due</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-rule">
                {r.accounts.map((a) => (
                  <tr key={a.accountId}>
                    <td className="py-2 pr-2">
                      <Link href={`/receivables/${a.accountId}`} className="font-semibold">
                        {a.accountName}
                      </Link>
                      <span className="block text-xs text-ink-faint">
                        {a.invoiceCount} open invoice{a.invoiceCount === 1 ? "" : "s"}
                        {a.oldestDays !== null && a.oldestDays > 0 ? `, oldest ${a.oldestDays} days past due` : ""}
                      </span>
                    </td>
                    {AGEING_BUCKETS.map((b) => (
                      <td key={b} className="py-2 pr-2 text-right">
                        <Money cents={a.ageing[b]} className={a.ageing[b] === 0 ? "text-ink-faint" : ""} />
                      </td>
                    ))}
                    <td className="py-2 text-right font-bold">
                      <Money cents={a.totalDueCents} />
                    </td>
                  </tr>
                ))}
              </tbody>
              <tfoot>
                <tr className="border-t-2 border-ink font-bold">
                  <td className="py-2 pr-2">All accounts</td>
                  {AGEING_BUCKETS.map((b) => (
                    <td key={b} className="py-2 pr-2 text-right">
                      <Money cents={r.ageing[b]} />
                    </td>
                  ))}
                  <td className="py-2 text-right">
                    <Money cents={r.totalDueCents} />
                  </td>
                </tr>
              </tfoot>
            </table>
          </div>
        </Card>
      </div>
    </>
  );
}
