// Issue 13: every list and every read of one page is served by an index, so its
// cost does not grow with history. Each case runs the real query function,
// captures the SQL it sends, and asks SQLite for the plan of each statement.
// The demo database has no ANALYZE statistics, so the planner chooses from the
// indexes alone, as it does on a fresh production file.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { invoices } from "@/db/schema";
import { auditTrail } from "@/db/queries/audit";
import { listAccountsForApi } from "@/db/queries/accounts";
import { findingsForWorkOrder } from "@/db/queries/finding-reads";
import { watchedConcerns } from "@/db/queries/intermittent-concerns";
import { readyToInvoice, waitingForPo, invoiceSection } from "@/db/queries/invoice-pages";
import { getInvoiceDetail, invoicesOfWorkOrder, listInvoices, openInvoices, paymentsOfAccount } from "@/db/queries/invoices";
import { outgoingMail } from "@/db/queries/mail-outbox";
import { listOccurrences } from "@/db/queries/occurrences";
import { listServiceRequests } from "@/db/queries/service-requests";
import { loadShopWorkOrderPage } from "@/db/queries/shop-work-order-page";
import { receivables } from "@/db/queries/statement";
import { timeSummary } from "@/db/queries/time-clock";
import { getUnitDetail, listUnits } from "@/db/queries/units";
import { floorLanes, listOpenWorkOrders } from "@/db/queries/work-order-list";
import { workOrderView } from "@/db/queries/work-order-view";
import type { SessionUser } from "@/lib/auth/session-user";
import { sessionUser } from "./helpers/app";
import { captureSql, growthIn, queryPlan } from "./helpers/query-plan";
import { workOrderByNumber } from "./helpers/work-orders";

/**
 * Tables that do not grow with history, so a scan or sort of them is fine:
 * shop_settings is one row; labor_rates and counters are a handful of rows the
 * owner keeps; the unit_search index is FTS5 (a virtual table, matched, not scanned).
 */
const SMALL = new Set(["shop_settings", "labor_rates", "counters", "unit_search"]);

/**
 * Partial indexes that hold only current work, so walking one whole is fine:
 * work_orders_to_bill_number_idx holds the visits not yet settled for billing
 * (nothing_to_bill = 0), which issuing, voiding and releasing keep to open work.
 */
const BOUNDED_INDEXES = ["work_orders_to_bill_number_idx"];

const LIMIT = 50;
let writer: SessionUser;
let tech: SessionUser;
let owner: SessionUser;
let clerk: SessionUser;
let supervisor: SessionUser;
let w1042: string;
let unitId: string;
let invoiceId: string;
let accountId: string;

beforeAll(async () => {
  [writer, tech, owner, clerk, supervisor] = await Promise.all([
    sessionUser("writer@quarry-road.example"),
    sessionUser("tech@quarry-road.example"),
    sessionUser("owner@quarry-road.example"),
    sessionUser("clerk@brennan-twp.example"),
    sessionUser("supervisor@brennan-twp.example"),
  ]);
  accountId = supervisor.accountId!;
  const wo = await workOrderByNumber(1042);
  w1042 = wo.id;
  unitId = wo.unitId;
  const [inv] = await getDb().select({ id: invoices.id }).from(invoices).where(eq(invoices.accountId, accountId)).limit(1);
  invoiceId = inv!.id;
});

/**
 * A sort that is allowed in one case, with the reason: the rows it sorts are
 * bounded by one record the page is about, not by the table.
 */
interface Allowance {
  sortOver: string;
  why: string;
}

const deferredOfUnit: Allowance = { sortOver: "SEARCH work_orders USING INDEX work_orders_unit_idx", why: "the held and declined lines of one unit's visits, newest change first" };
const readingsOfFindings: Allowance = { sortOver: "SEARCH finding_readings", why: "the checked readings of one work order's findings, in their order" };

const cases: [string, () => Promise<unknown>, Allowance[]?][] = [
  // Lists (API and pages)
  ["open work orders, shop (the Floor, GET /api/v1/work-orders)", () => listOpenWorkOrders(writer, { limit: LIMIT })],
  ["the Floor's lanes and counts", () => floorLanes(writer)],
  ["the Floor as a technician (their own open work)", () => floorLanes(tech, { mineFor: tech.id })],
  ["open work orders, fleet", () => listOpenWorkOrders(supervisor, { limit: LIMIT })],
  ["open work orders of one status", () => listOpenWorkOrders(writer, { limit: LIMIT, status: "waiting_approval" })],
  ["open work orders of one account", () => listOpenWorkOrders(writer, { limit: LIMIT, accountId })],
  ["every work order, shop (work-order list with past visits)", () => listOpenWorkOrders(writer, { limit: LIMIT, all: true })],
  ["every work order, fleet", () => listOpenWorkOrders(supervisor, { limit: LIMIT, all: true })],
  ["invoices, fleet clerk (GET /api/v1/invoices)", () => listInvoices(clerk, { limit: LIMIT })],
  ["invoices, shop", () => listInvoices(owner, { limit: LIMIT })],
  ["invoices of one account, shop", () => listInvoices(owner, { limit: LIMIT, accountId })],
  ["invoices of one status, fleet", () => listInvoices(clerk, { limit: LIMIT, status: "open" })],
  ["invoices part paid, shop (the invoice list's filter)", () => listInvoices(owner, { limit: LIMIT, paymentState: "partly_paid" })],
  ["paid and void invoices, fleet", () => listInvoices(clerk, { limit: LIMIT, settled: true })],
  ["invoices of a work order", () => invoicesOfWorkOrder(owner, w1042)],
  ["open invoices of an account (statement)", () => openInvoices(accountId)],
  ["payments of an account in a period", () => paymentsOfAccount(accountId, "2026-01-01T00:00:00.000Z", "2027-01-01T00:00:00.000Z")],
  ["receivables, fleet", () => receivables(clerk)],
  ["units, fleet (GET /api/v1/units)", () => listUnits(supervisor, { limit: LIMIT })],
  ["units, shop", () => listUnits(writer, { limit: LIMIT })],
  ["units in the shop", () => listUnits(writer, { limit: LIMIT, inShop: true })],
  ["units by number prefix", () => listUnits(writer, { limit: LIMIT, q: "T" })],
  ["occurrences of a unit", () => listOccurrences(supervisor, unitId, { limit: LIMIT })],
  ["defect reports, fleet", () => listServiceRequests(supervisor, { limit: LIMIT })],
  ["defect reports, shop", () => listServiceRequests(writer, { limit: LIMIT })],
  ["outgoing mail", () => outgoingMail({ limit: LIMIT })],
  ["outgoing mail, failed", () => outgoingMail({ limit: LIMIT, status: "failed" })],
  ["audit trail of a work order", () => auditTrail("work_order", w1042)],
  ["watched concerns of a unit", () => watchedConcerns(supervisor, { unitId })],
  ["accounts (GET /api/v1/accounts)", () => listAccountsForApi(owner, { limit: LIMIT })],
  // One page's reads
  ["a work order's view (GET /api/v1/work-orders/:id, the approval page)", () => workOrderView(supervisor, w1042), [readingsOfFindings]],
  ["the shop's work-order page", () => loadShopWorkOrderPage(writer, w1042), [readingsOfFindings, deferredOfUnit]],
  ["a work order's findings", () => findingsForWorkOrder(writer, w1042), [readingsOfFindings]],
  ["a work order's time", () => timeSummary(w1042)],
  ["a work order's invoice section", () => invoiceSection(owner, w1042)],
  ["an invoice", () => getInvoiceDetail(clerk, invoiceId)],
  [
    "a unit's page (a page of visits, readings)",
    () => getUnitDetail(supervisor, unitId, { visits: { limit: LIMIT } }),
    [deferredOfUnit],
  ],
  // Desk lists
  ["ready to invoice", () => readyToInvoice(owner)],
  ["waiting for a PO", () => waitingForPo(clerk)],
];

describe("query plans (issue 13): no full scan or whole-result sort of a table that grows", () => {
  it.each(cases)("%s", async (_name, run, allowed = []) => {
    const statements = await captureSql(run);
    expect(statements.length).toBeGreaterThan(0);
    const problems: string[] = [];
    for (const stmt of statements) {
      const found = growthIn(await queryPlan(stmt), SMALL, stmt.sql).filter(
        (p) => !allowed.some((a) => p.includes(`(over ${a.sortOver}`)) && !BOUNDED_INDEXES.some((i) => p.includes(`INDEX ${i} (the whole index`)),
      );
      if (found.length) problems.push(`${found.join("; ")}\n    in: ${stmt.sql}`);
    }
    expect(problems, problems.join("\n")).toEqual([]);
  });

  it("sees a full scan and a temp B-tree sort when there is one (the checker can fail)", async () => {
    const plan = await queryPlan({ sql: "select id from work_orders where title = ? order by promised_at", args: ["x"] });
    expect(growthIn(plan, SMALL)).toEqual(["SCAN work_orders", "USE TEMP B-TREE FOR ORDER BY (over SCAN work_orders)"]);
    expect(growthIn(await queryPlan({ sql: "select id from labor_rates order by name", args: [] }), SMALL)).toEqual([]);
    // A count over every status walks the whole status index: found without a LIMIT, not with one.
    const counting = "select status, count(*) from work_orders where status <> 'released' group by status";
    expect(growthIn(await queryPlan({ sql: counting, args: [] }), SMALL, counting)).toEqual(["SCAN work_orders USING COVERING INDEX work_orders_status_number_idx (the whole index, no LIMIT)"]);
  });
});
