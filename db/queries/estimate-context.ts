import { and, eq, sql, type SQL } from "drizzle-orm";
import type { Reader } from "@/db/client";
import { accounts, estimateLines, shopSettings, units, workOrders, type Account, type EstimateLine as LineRow, type ShopSettings as ShopRow } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { addDays, startOfDayIso } from "@/lib/dates";
import { fiscalYearOf, type AccountSettings, type EstimateLine, type FiscalYear, type ShopSettings } from "@/lib/estimate";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { notFound } from "@/lib/http/problem";
import { prepared } from "@/db/prepared";
import { scopedTo, scopedToPlaceholder, scopeOf } from "./scope";

export function toEstimateLine(row: LineRow): EstimateLine {
  return {
    id: row.id,
    kind: row.kind,
    quantityMilli: row.quantityMilli,
    unitPriceCents: row.unitPriceCents,
    taxable: row.taxable,
    // A core that came back is credited: it leaves the totals, as on the invoice.
    coreChargeCents: row.coreReturnedAt ? 0 : row.coreChargeCents,
    state: row.state,
    version: row.version,
    approvedByUserId: row.approvedByUserId,
    byStanding: row.byStanding,
    approvedAmountCents: row.approvedAmountCents,
    isDiagnosis: row.isDiagnosis,
    extendsLineId: row.extendsLineId,
  };
}

export function toAccountSettings(a: Account): AccountSettings {
  return {
    taxExempt: a.taxExempt,
    taxRateMilliPct: a.taxRateMilliPct,
    shopSuppliesExempt: a.shopSuppliesExempt,
    standingAuthorisationCents: a.standingAuthorisationCents,
    repairBudgetCents: a.repairBudgetCents,
    fiscalYearStartMonth: a.fiscalYearStartMonth,
    overrunPercentMilli: a.overrunPercentMilli,
    overrunCapCents: a.overrunCapCents,
    overrunFloorCents: a.overrunFloorCents,
  };
}

export function toShopSettings(s: ShopRow): ShopSettings {
  return {
    shopSuppliesRateMilliPct: s.shopSuppliesRateMilliPct,
    shopSuppliesCapCents: s.shopSuppliesCapCents,
    shopSuppliesTaxable: s.shopSuppliesTaxable,
  };
}

/** The work order's own row, scoped to the user's account; another account's is not found. */
export async function loadWorkOrderRow(tx: Reader, user: Pick<SessionUser, "role" | "accountId">, workOrderId: string) {
  const [wo] = await tx
    .select()
    .from(workOrders)
    .where(and(eq(workOrders.id, workOrderId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  if (!wo) throw notFound("That work order");
  return wo;
}

function contextQueries(woId: SQL) {
  return {
    head: prepared((r) =>
      r
        .select({ wo: workOrders, account: accounts, shop: shopSettings, unitNumber: units.unitNumber })
        .from(workOrders)
        .innerJoin(accounts, eq(accounts.id, workOrders.accountId))
        .innerJoin(units, eq(units.id, workOrders.unitId))
        .leftJoin(shopSettings, eq(shopSettings.id, 1))
        .where(and(sql`${workOrders.id} = ${woId}`, scopedToPlaceholder(workOrders.accountId)))
        .limit(1)
        .prepare(),
    ),
    lines: prepared((r) => r.select().from(estimateLines).where(sql`${estimateLines.workOrderId} = ${woId}`).orderBy(estimateLines.position, estimateLines.createdAt).prepare()),
  };
}

// Read on every view and inside every decision: built once (db/prepared.ts), by the work order or by one of its lines.
const byWorkOrder = contextQueries(sql`${sql.placeholder("of")}`);
const byLine = contextQueries(sql`(select ${estimateLines.workOrderId} from ${estimateLines} where ${estimateLines.id} = ${sql.placeholder("of")})`);

/**
 * Everything the estimate rules need about one work order, read inside the
 * caller's transaction so the check and the write see the same rows: the work
 * order with its account, unit number and the shop's settings in one statement,
 * then its lines. `of` names the work order, or one of its lines.
 */
export async function loadEstimateContext(tx: Reader, user: Pick<SessionUser, "role" | "accountId">, of: string | { lineId: string }) {
  const queries = typeof of === "string" ? byWorkOrder : byLine;
  const values = { of: typeof of === "string" ? of : of.lineId };
  const [head, lines] = await Promise.all([queries.head(tx).get({ ...values, ...scopeOf(user) }), queries.lines(tx).all(values)]);
  if (!head) throw notFound(typeof of === "string" ? "That work order" : "That line");
  if (!head.shop) throw new Error("shop settings missing");
  return { wo: head.wo, account: head.account, shop: head.shop, unitNumber: head.unitNumber, lines };
}

export type EstimateContext = Awaited<ReturnType<typeof loadEstimateContext>>;

type FiscalYearBounds = { fy: FiscalYear; fromIso: string; toIso: string };
// The fiscal year holding an instant is the one whose bounds hold it, so the last one found per start month and zone is reused while `now` is inside it (the time-zone arithmetic was a good part of a decision's own work).
const lastFiscalYear = new Map<string, FiscalYearBounds>();

/** The fiscal year containing `now` for an account, with its UTC bounds in the shop's time zone. */
/** Fiscal years turn at midnight in the shop's time zone (APP_TIME_ZONE), the one zone every date uses. */
export function currentFiscalYear(account: Pick<Account, "fiscalYearStartMonth">, now = new Date(), timeZone = env().APP_TIME_ZONE): FiscalYearBounds {
  const key = `${account.fiscalYearStartMonth}|${timeZone}`;
  const at = now.toISOString();
  const known = lastFiscalYear.get(key);
  if (known && known.fromIso <= at && at < known.toIso) return known;
  const fy: FiscalYear = fiscalYearOf(calendarDate(now, timeZone), account.fiscalYearStartMonth);
  const bounds = { fy, fromIso: startOfDayIso(fy.startDate, timeZone), toIso: startOfDayIso(addDays(fy.endDate, 1), timeZone) };
  lastFiscalYear.set(key, bounds);
  return bounds;
}
