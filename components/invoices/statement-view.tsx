import Link from "next/link";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Money } from "@/components/ui/money";
import type { Statement } from "@/db/queries/statement";
import { formatDate } from "@/lib/format";
import { addDays } from "@/lib/dates";
import { PAYMENT_METHOD_LABELS } from "@/lib/invoices/format";
import { AGEING_LABELS } from "@/lib/receivables/ageing";
import { AgeingSummary } from "./ageing-summary";
import { CsvExportForm } from "./csv-export-form";
import { PaymentStatePill } from "./payment-state-pill";

function pastDue(days: number): string {
  if (days < 0) return `due in ${-days} day${days === -1 ? "" : "s"}`;
  if (days === 0) return "due today";
  return `${days} day${days === 1 ? "" : "s"} past due`;
}

/** An account's statement: ageing, open invoices oldest first, payments in the period, CSV export. */
export function StatementView({ statement: s, hrefFor }: { statement: Statement; hrefFor: (invoiceId: string) => string }) {
  return (
    <div className="flex flex-col gap-4">
      <Card>
        <CardTitle>Owed as of {formatDate(s.asOf)}</CardTitle>
        <AgeingSummary ageing={s.ageing} totalDueCents={s.totalDueCents} />
      </Card>

      <Card>
        <CardTitle>Open invoices</CardTitle>
        {s.invoices.length === 0 ? (
          <EmptyState title="Nothing is owed">Every invoice is paid.</EmptyState>
        ) : (
          <ul className="divide-y divide-rule" data-testid="statement-invoices">
            {s.invoices.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2" data-bucket={i.bucket}>
                <div>
                  <Link href={hrefFor(i.id)} className="font-bold">
                    {i.label}
                  </Link>{" "}
                  <span className="text-sm">· Unit {i.unitNumber}{i.poNumber ? ` · PO ${i.poNumber}` : ""}</span>
                  <p className="text-sm text-ink-faint">
                    Due {formatDate(i.dueAt)}, {pastDue(i.daysPastDue)} · {AGEING_LABELS[i.bucket]}
                  </p>
                </div>
                <div className="flex items-center gap-2">
                  <span className="text-right">
                    <Money cents={i.balanceCents} className="block font-bold" />
                    {i.paidCents > 0 ? (
                      <span className="block text-xs text-ink-faint">
                        of <Money cents={i.totalCents} />
                      </span>
                    ) : null}
                  </span>
                  <PaymentStatePill state={i.paymentState} size="sm" />
                </div>
              </li>
            ))}
          </ul>
        )}
      </Card>

      <Card>
        <CardTitle>
          Payments received {formatDate(s.period.from)} – {formatDate(s.period.to)}
        </CardTitle>
        {s.payments.length === 0 ? (
          <p className="text-ink-faint">No payments in this period.</p>
        ) : (
          <ul className="divide-y divide-rule text-sm">
            {s.payments.map((p) => (
              <li key={p.id} className="py-1.5">
                {/* Amount on the first line, always right-aligned, so a column of payments reads down. */}
                <p className="flex justify-between gap-3">
                  <span>
                    {formatDate(p.receivedAt, s.timeZone)} · <Link href={hrefFor(p.invoiceId)}>{p.invoiceLabel}</Link>
                  </span>
                  <Money cents={p.amountCents} />
                </p>
                <p className="text-ink-soft">
                  {PAYMENT_METHOD_LABELS[p.method] ?? p.method}
                  {p.reference ? ` · ${p.reference}` : ""}
                  {p.status !== "applied" ? <span className="font-semibold text-rust-deep"> ({p.status === "held" ? "held for review" : "returned"})</span> : null}
                </p>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-sm font-semibold">
          Applied in the period: <Money cents={s.paymentsInPeriodCents} />
        </p>
      </Card>

      <Card className="no-print">
        <CardTitle>Export for your accounting</CardTitle>
        <CsvExportForm accountId={s.accountId} from={addDays(s.asOf, -89)} to={s.asOf} />
      </Card>
    </div>
  );
}
