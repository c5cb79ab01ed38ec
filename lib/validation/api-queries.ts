import { z } from "zod";
import { INVOICE_STATUSES, SERVICE_REQUEST_STATUSES, WORK_ORDER_STATUSES } from "@/lib/domain";
import { pageQuery } from "@/lib/http/pagination";

/**
 * Path parameters and query strings of the API routes. They live here, beside
 * the bodies, so the route parses exactly what the OpenAPI document
 * (lib/api-schema) says it takes.
 */
const id = z.string().min(1).max(64);

export const idParams = z.object({ id });
export const occurrenceParams = z.object({ id, occurrenceId: id });

/** A query flag: only the word `true` turns it on. */
const flag = z.enum(["true", "false"]).optional().transform((v) => v === "true");
const day = z.iso.date("Write the date as YYYY-MM-DD.").optional();

export const accountListQuery = pageQuery.extend({ archived: flag });

export const invitationListQuery = z.object({ accountId: id.optional() });

export const invoiceListQuery = pageQuery.extend({ status: z.enum(INVOICE_STATUSES).optional(), accountId: z.string().max(64).optional() });

export const serviceRequestListQuery = pageQuery.extend({ status: z.enum(SERVICE_REQUEST_STATUSES).optional(), unitId: id.optional() });

export const unitListQuery = pageQuery.extend({
  inShop: flag,
  retired: flag,
  q: z.string().trim().max(100).optional(),
  accountId: id.optional(),
});

export const workOrderListQuery = pageQuery.extend({
  status: z.enum(WORK_ORDER_STATUSES).optional(),
  all: flag,
  accountId: id.optional(),
  technicianId: id.optional(),
  openedFrom: day,
  openedTo: day,
});

export const occurrenceListQuery = pageQuery.extend({ concernId: id.optional() });
