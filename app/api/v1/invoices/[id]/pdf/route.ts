import { getInvoiceDetail } from "@/db/queries/invoices";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { renderInvoicePdf } from "@/lib/server/pdf/invoice-pdf";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const invoice = await getInvoiceDetail(user, params.id);
  if (!invoice) throw notFound("That invoice");
  const pdf = await renderInvoicePdf(invoice, env().APP_TIME_ZONE);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${invoice.label}.pdf"`,
      "cache-control": "private, no-store",
    },
  });
});
