import { listInvoices } from "@/db/queries/invoices";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { invoiceListQuery } from "@/lib/validation/api-queries";

export const dynamic = "force-dynamic";

export const GET = apiRoute(
  {
    roles: CAN.anyone,
    query: invoiceListQuery,
  },
  ({ user, query }) => listInvoices(user, query),
);
