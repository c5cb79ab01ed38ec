import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CheckoutReturn } from "@/components/invoices/checkout-return";
import { InvoiceDocument } from "@/components/invoices/invoice-document";
import { PayButton } from "@/components/invoices/pay-button";
import { PrintButton } from "@/components/invoices/print-button";
import { buttonClass } from "@/components/ui/button";
import { latestCheckout } from "@/db/queries/checkout";
import { getInvoiceDetail } from "@/db/queries/invoices";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN, hasRole } from "@/lib/auth/policy";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Invoice" };

export default async function FleetInvoicePage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ checkout?: string }>;
}) {
  const user = await requirePageRole(CAN.pay);
  const [{ id }, { checkout }] = await Promise.all([params, searchParams]);
  // Scoped to the user's account: another account's invoice is simply not found.
  const inv = await getInvoiceDetail(user, id);
  if (!inv) notFound();
  const outcome = checkout === "returned" || checkout === "cancelled" ? checkout : null;
  const last = outcome === "returned" ? await latestCheckout(inv.id) : null;
  const payable = inv.status === "open" && inv.balanceCents > 0 && hasRole(user, CAN.pay);
  const waiting = outcome === "returned" && last?.status !== "complete";
  return (
    <div className="flex flex-col gap-3">
      {outcome ? <CheckoutReturn outcome={outcome} settled={last?.status === "complete"} /> : null}
      <div className="no-print flex flex-wrap items-center gap-2">
        {payable && !waiting ? <PayButton invoiceId={inv.id} balanceCents={inv.balanceCents} /> : null}
        <PrintButton />
        <a href={`/api/v1/invoices/${inv.id}/pdf`} className={buttonClass("secondary", "no-underline")} download>
          PDF
        </a>
      </div>
      <InvoiceDocument invoice={inv} timeZone={env().APP_TIME_ZONE} />
    </div>
  );
}
