import Link from "next/link";
import { Card, CardTitle } from "@/components/ui/card";
import { Money } from "@/components/ui/money";
import { invoiceSection } from "@/db/queries/invoice-pages";
import { CAN, hasRole } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";
import { env } from "@/lib/env";
import { formatDate } from "@/lib/format";
import { IssueInvoiceForm } from "./issue-invoice-form";
import { MarkDoneForm } from "./mark-done-form";
import { PaymentStatePill } from "./payment-state-pill";

/** The work order's Invoice section: what would be billed, and issuing it (owner, writer). */
export async function WorkOrderInvoice({ workOrderId, user }: { workOrderId: string; user: SessionUser }) {
  const data = await invoiceSection(user, workOrderId);
  if (!data) return null;
  const canIssue = hasRole(user, CAN.issueInvoices);
  const { draft, live, voided } = data;
  const t = draft.totals;
  const timeZone = env().APP_TIME_ZONE;
  return (
    <Card id="invoice" data-testid="wo-invoice">
      <CardTitle>Invoice</CardTitle>
      {live ? (
        <div className="flex flex-wrap items-center justify-between gap-2">
          <p>
            <Link href={`/invoices/${live.id}`} className="font-bold">
              {live.label}
            </Link>{" "}
            <span className="text-sm text-ink-faint">issued {formatDate(live.issuedAt, timeZone)}, due {formatDate(live.dueAt)}</span>
          </p>
          <span className="flex items-center gap-2">
            <Money cents={live.balanceCents} className="font-bold" />
            <PaymentStatePill state={live.paymentState} size="sm" />
          </span>
        </div>
      ) : (
        <div className="flex flex-col gap-3">
          {canIssue && data.notDone.length > 0 ? <MarkDoneForm workOrderId={workOrderId} lines={data.notDone} /> : null}
          {draft.lines.length === 0 ? (
            <p className="text-ink-faint">Nothing to invoice yet: no approved line is marked done.</p>
          ) : (
            <>
              <dl className="grid grid-cols-[1fr_auto] gap-x-4 text-sm">
                <dt className="text-ink-soft">
                  {draft.lines.length} done line{draft.lines.length === 1 ? "" : "s"}
                </dt>
                <dd className="text-right">
                  <Money cents={t.linesCents} />
                </dd>
                <dt className="text-ink-soft">Shop supplies</dt>
                <dd className="text-right">
                  <Money cents={t.shopSuppliesCents} />
                </dd>
                <dt className="text-ink-soft">{data.account.taxExempt ? `Tax (exempt, ${data.account.taxExemptCertificate ?? "certificate on file"})` : "Tax"}</dt>
                <dd className="text-right">
                  <Money cents={t.taxCents} />
                </dd>
                {t.coreCents > 0 ? (
                  <>
                    <dt className="text-ink-soft">Core charges</dt>
                    <dd className="text-right">
                      <Money cents={t.coreCents} />
                    </dd>
                  </>
                ) : null}
                <dt className="font-bold">Total</dt>
                <dd className="text-right font-bold">
                  <Money cents={t.totalCents} />
                </dd>
              </dl>
              <p className="text-sm text-ink-faint">
                {data.account.name} · net {data.account.paymentTermsDays} days
              </p>
              {canIssue ? (
                <IssueInvoiceForm
                  workOrderId={workOrderId}
                  poNumber={data.poNumber}
                  poRequired={data.account.poRequired}
                  accountName={data.account.name}
                  totalCents={t.totalCents}
                  replaces={voided[0]?.label ?? null}
                />
              ) : null}
            </>
          )}
        </div>
      )}
      {voided.length > 0 ? (
        <p className="mt-3 text-sm text-ink-faint">
          Void:{" "}
          {voided.map((v, i) => (
            <span key={v.id}>
              {i > 0 ? ", " : ""}
              <Link href={`/invoices/${v.id}`}>{v.label}</Link>
            </span>
          ))}
        </p>
      ) : null}
    </Card>
  );
}
