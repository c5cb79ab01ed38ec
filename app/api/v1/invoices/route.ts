import { z } from "zod";
import { listInvoices } from "@/db/queries/invoices";
import { CAN } from "@/lib/auth/policy";
import { INVOICE_STATUSES } from "@/lib/domain";
import { apiRoute } from "@/lib/server/http/api-route";
import { pageQuery } from "@/lib/http/pagination";

export const dynamic = "force-dynamic";

export const GET = apiRoute(
  {
    roles: CAN.anyone,
    query: pageQuery.extend({ status: z.enum(INVOICE_STATUSES).optional(), accountId: z.string().max(64).optional() }),
  },
  ({ user, query }) => listInvoices(user, query),
);
