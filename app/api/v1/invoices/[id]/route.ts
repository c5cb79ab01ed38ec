import { getInvoiceDetail } from "@/db/queries/invoices";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const invoice = await getInvoiceDetail(user, params.id);
  if (!invoice) throw notFound("That invoice");
  return invoice;
});
