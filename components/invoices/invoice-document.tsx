import { Money } from "@/components/ui/money";
import type { InvoiceDetail } from "@/db/queries/invoices";
import { LINE_KIND_LABELS } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { formatPriceOf, formatQuantityOf, formatUnitPriceOf, PAYMENT_METHOD_LABELS } from "@/lib/invoices/format";
import { PaymentStatePill } from "./payment-state-pill";

/** The invoice as a document: what the PDF shows, in our own look, and what prints. */
export function InvoiceDocument({ invoice: inv, timeZone }: { invoice: InvoiceDetail; timeZone: string }) {
  const t = inv.totals;
  const totals: [string, number][] = [
    ["Labour", t.laborCents],
    ["Parts", t.partsCents],
    ["Sublet", t.subletCents],
    ["Fees", t.feesCents],
    ["Shop supplies", t.shopSuppliesCents],
  ];
  return (
    <article className="rounded-card border border-rule bg-white p-4 sm:p-6 print:rounded-none print:border-0 print:p-0" data-testid="invoice-document">
      <header className="flex flex-col justify-between gap-3 border-b-2 border-ink pb-3 sm:flex-row sm:gap-4 print:flex-row">
        <div>
          <p className="text-lg font-bold">{inv.shop?.name}</p>
          <p className="text-sm whitespace-pre-line text-ink-soft">
            {[...(inv.shop?.addressLines ?? []), inv.shop?.phone, inv.shop?.email].filter(Boolean).join("\n")}
          </p>
        </div>
        <div className="sm:text-right print:text-right">
          <p className="text-sm font-bold tracking-widest text-rust-deep uppercase">Invoice</p>
          <p className="text-2xl font-bold">{inv.label}</p>
          <div className="mt-1">
            <PaymentStatePill state={inv.paymentState} />
          </div>
        </div>
      </header>

      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 border-b border-rule py-3 text-sm sm:grid-cols-4">
        <Fact label="Issued" value={formatDate(inv.issuedAt, timeZone)} />
        <Fact label="Due" value={formatDate(inv.dueAt)} />
        <Fact label="Terms" value={`Net ${inv.termsDays} days`} />
        <Fact label="PO number" value={inv.poNumber ?? "—"} />
      </dl>

      <div className="grid gap-4 border-b border-rule py-3 text-sm sm:grid-cols-2">
        <div>
          <p className="text-xs font-bold tracking-wide text-ink-faint uppercase">Bill to</p>
          <p className="font-semibold">{inv.billTo.accountName}</p>
          <p className="whitespace-pre-line">{[inv.billTo.contactName, inv.billTo.address, inv.billTo.email].filter(Boolean).join("\n")}</p>
          {inv.taxExemptCertificate !== null ? (
            <p className="mt-1 font-semibold">Tax exempt · certificate {inv.taxExemptCertificate || "on file"}</p>
          ) : null}
        </div>
        {inv.unit ? (
          <div>
            <p className="text-xs font-bold tracking-wide text-ink-faint uppercase">Unit</p>
            <p className="font-semibold">Unit {inv.unit.unitNumber}</p>
            <p>{[inv.unit.year, inv.unit.description].filter(Boolean).join(" ")}</p>
            <p className="figures">{inv.unit.vin ? `VIN ${inv.unit.vin}` : inv.unit.serialNumber ? `Serial ${inv.unit.serialNumber}` : ""}</p>
            <p>
              {inv.workOrderNumber}: {inv.unit.workOrderTitle}
            </p>
          </div>
        ) : null}
      </div>

      {inv.unit?.concerns?.length ? (
        <section className="border-b border-rule py-3 text-sm" data-testid="invoice-three-cs">
          <h2 className="text-xs font-bold tracking-wide text-ink-faint uppercase">Work performed</h2>
          <ol className="mt-1 flex flex-col gap-2">
            {inv.unit.concerns.map((c, i) => (
              <li key={i} className="grid grid-cols-[6.5rem_1fr] gap-x-2">
                <span className="text-ink-faint">Complaint {i + 1}</span>
                <span className="font-semibold">{c.complaint}</span>
                <span className="text-ink-faint">Cause</span>
                <span>{c.cause || "—"}</span>
                <span className="text-ink-faint">Correction</span>
                <span>{c.correction || "—"}</span>
              </li>
            ))}
          </ol>
        </section>
      ) : null}

      <table className="mt-3 w-full text-sm">
        <caption className="sr-only">Lines</caption>
        <thead>
          <tr className="border-b-2 border-ink text-left text-xs tracking-wide text-ink-faint uppercase">
            <th className="py-1 pr-2 font-bold">Description</th>
            <th className="hidden py-1 pr-2 font-bold sm:table-cell">Kind</th>
            <th className="py-1 pr-2 text-right font-bold">Qty</th>
            <th className="hidden py-1 pr-2 text-right font-bold sm:table-cell">Unit price</th>
            <th className="py-1 text-right font-bold">Amount</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {inv.lines.map((l) => (
            <tr key={l.id} className="align-top">
              <td className="py-1.5 pr-2">
                {l.description}
                {l.partNumber ? <span className="text-ink-faint"> · {l.partNumber}</span> : null}
                {l.coreChargeCents > 0 ? (
                  <span className="block text-xs text-ink-faint">
                    Core charge <Money cents={l.coreChargeCents} /> each, refunded when the core comes back
                  </span>
                ) : null}
                <span className="block text-xs text-ink-faint sm:hidden">
                  {LINE_KIND_LABELS[l.kind]} · <span className="figures">{formatPriceOf(l.quantityMilli, l.unitPriceCents, l.kind)}</span>
                </span>
              </td>
              <td className="hidden py-1.5 pr-2 sm:table-cell">{LINE_KIND_LABELS[l.kind]}</td>
              <td className="figures py-1.5 pr-2 text-right whitespace-nowrap">{formatQuantityOf(l.quantityMilli, l.kind)}</td>
              <td className="figures hidden py-1.5 pr-2 text-right whitespace-nowrap sm:table-cell">{formatUnitPriceOf(l.unitPriceCents, l.kind)}</td>
              <td className="py-1.5 text-right">
                <Money cents={l.amountCents} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>

      <dl className="mt-3 ml-auto grid max-w-xs grid-cols-[1fr_auto] gap-x-4 gap-y-0.5 border-t border-rule pt-2 text-sm" data-testid="invoice-totals">
        {totals.filter(([, c]) => c !== 0).map(([label, c]) => (
          <Row key={label} label={label} cents={c} />
        ))}
        <Row label={inv.taxExemptCertificate !== null ? "Tax (exempt)" : `Tax ${inv.taxRatePercent}%`} cents={t.taxCents} />
        {t.coreCents !== 0 ? <Row label="Core charges (untaxed)" cents={t.coreCents} /> : null}
        <Row label="Total" cents={inv.totalCents} strong />
        <Row label="Paid" cents={inv.paidCents} />
        {inv.creditedCents !== 0 ? <Row label="Credited" cents={inv.creditedCents} /> : null}
        <Row label="Balance due" cents={inv.balanceCents} strong />
      </dl>

      {inv.payments.length > 0 ? (
        <section className="mt-4 border-t border-rule pt-2">
          <h2 className="text-xs font-bold tracking-wide text-ink-faint uppercase">Payments</h2>
          <ul className="divide-y divide-rule text-sm">
            {inv.payments.map((p) => (
              <li key={p.id} className="flex flex-wrap justify-between gap-2 py-1.5">
                <span>
                  {formatDate(p.receivedAt, timeZone)} · {PAYMENT_METHOD_LABELS[p.method] ?? p.method}
                  {p.reference ? ` · ${p.reference}` : ""}
                  {!p.applied ? (
                    <span className="ml-1 font-semibold text-rust-deep">{p.resolution === "returned" ? "(returned to the payer)" : "(held for the shop to review)"}</span>
                  ) : null}
                </span>
                <Money cents={p.amountCents} className={p.applied ? "" : "line-through decoration-1"} />
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {inv.creditNotes.length > 0 ? (
        <section className="mt-4 border-t border-rule pt-2" data-testid="credit-notes">
          <h2 className="text-xs font-bold tracking-wide text-ink-faint uppercase">Credit notes</h2>
          <ul className="divide-y divide-rule text-sm">
            {inv.creditNotes.map((c) => (
              <li key={c.id} className="py-1.5">
                <p className="flex justify-between gap-3">
                  <span className="font-semibold">
                    {c.label} · {formatDate(c.issuedAt, timeZone)}
                  </span>
                  <Money cents={-c.amountCents} />
                </p>
                <p className="text-ink-soft">{c.reason}</p>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <footer className="mt-4 border-t border-rule pt-2 text-sm text-ink-soft">
        {inv.paymentState === "void" ? (
          <p className="font-semibold text-rust-deep">
            Void{inv.voidReason ? `: ${inv.voidReason.replace(/[.\s]+$/, "")}` : ""}. Nothing is owed on this invoice.
          </p>
        ) : (
          <p>
            Terms: net {inv.termsDays} days. Please pay by {formatDate(inv.dueAt)}, quoting {inv.label}
            {inv.poNumber ? ` and PO ${inv.poNumber}` : ""}.
          </p>
        )}
        {inv.shop?.footer ? <p className="mt-1">{inv.shop.footer}</p> : null}
      </footer>
    </article>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs text-ink-faint">{label}</dt>
      <dd className="font-semibold">{value}</dd>
    </div>
  );
}

function Row({ label, cents, strong = false }: { label: string; cents: number; strong?: boolean }) {
  return (
    <>
      <dt className={strong ? "font-bold" : "text-ink-soft"}>{label}</dt>
      <dd className={`text-right ${strong ? "font-bold" : ""}`}>
        <Money cents={cents} />
      </dd>
    </>
  );
}
