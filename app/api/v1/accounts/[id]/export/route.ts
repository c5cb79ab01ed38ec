import { exportRows } from "@/db/queries/statement";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { toCsv } from "@/lib/invoices/csv";
import { exportQuery } from "@/lib/validation/invoices";

export const dynamic = "force-dynamic";

/** Invoices and payments from..to as CSV (columns in the README, "CSV export"). */
export const GET = apiRoute({ roles: CAN.readStatement, params: idParams, query: exportQuery }, async ({ user, params, query }) => {
  const rows = await exportRows(user, params.id, query.from, query.to);
  if (!rows) throw notFound("That account");
  return new Response(toCsv(rows.invoices, rows.payments, rows.credits), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="invoices-payments-${query.from}-to-${query.to}.csv"`,
      "cache-control": "private, no-store",
    },
  });
});
