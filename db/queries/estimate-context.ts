import { and, eq, gte, inArray, lt, sql } from "drizzle-orm";
import type { Reader } from "@/db/client";
import { accounts, estimateLines, shopSettings, workOrders, type Account, type EstimateLine as LineRow, type ShopSettings as ShopRow } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { addDays, startOfDayIso } from "@/lib/dates";
import { APPROVED_STATES, fiscalYearOf, type AccountSettings, type EstimateLine, type FiscalYear, type ShopSettings } from "@/lib/estimate";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { notFound } from "@/lib/http/problem";
import { scopedTo } from "./scope";

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

/**
 * Everything the estimate rules need about one work order, read inside the
 * caller's transaction so the check and the write see the same rows.
 */
export async function loadEstimateContext(tx: Reader, user: SessionUser, workOrderId: string) {
  const wo = await loadWorkOrderRow(tx, user, workOrderId);
  const [[account], [shop], lines] = await Promise.all([
    tx.select().from(accounts).where(eq(accounts.id, wo.accountId)).limit(1),
    tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).limit(1),
    tx.select().from(estimateLines).where(eq(estimateLines.workOrderId, wo.id)).orderBy(estimateLines.position, estimateLines.createdAt),
  ]);
  if (!account || !shop) throw new Error("work order without account or shop settings");
  return { wo, account, shop, lines };
}

export type EstimateContext = Awaited<ReturnType<typeof loadEstimateContext>>;

/** The fiscal year containing `now` for an account, with its UTC bounds in the shop's time zone. */
/** Fiscal years turn at midnight in the shop's time zone (APP_TIME_ZONE), the one zone every date uses. */
export function currentFiscalYear(account: Pick<Account, "fiscalYearStartMonth">, now = new Date(), timeZone = env().APP_TIME_ZONE) {
  const fy: FiscalYear = fiscalYearOf(calendarDate(now, timeZone), account.fiscalYearStartMonth);
  return { fy, fromIso: startOfDayIso(fy.startDate, timeZone), toIso: startOfDayIso(addDays(fy.endDate, 1), timeZone) };
}

/** What the account has approved in the fiscal year, every work order (amounts at approval; credits make no room, see countedCents). */
export async function budgetUsedCents(tx: Reader, accountId: string, bounds: { fromIso: string; toIso: string }): Promise<number> {
  const [row] = await tx
    .select({ total: sql<number>`coalesce(sum(max(${estimateLines.approvedAmountCents}, 0)), 0)` })
    .from(estimateLines)
    .innerJoin(workOrders, eq(workOrders.id, estimateLines.workOrderId))
    .where(
      and(
        eq(workOrders.accountId, accountId),
        inArray(estimateLines.state, [...APPROVED_STATES]),
        gte(estimateLines.approvedAt, bounds.fromIso),
        lt(estimateLines.approvedAt, bounds.toIso),
      ),
    );
  return Number(row?.total ?? 0);
}
