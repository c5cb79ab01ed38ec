import { asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accounts, laborRates } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel, type LineKind } from "@/lib/domain";
import { isApprovedState } from "@/lib/estimate";
import { lineAmountCents } from "@/lib/money";
import { toAccountSettings, toShopSettings } from "./estimate-context";
import { deferredLinesForUnit } from "./estimate-lines";
import { getShopSettings } from "./settings";
import { timeSummary } from "./time-clock";
import { workOrderView } from "./work-order-view";

/** Deferred lines as the estimate editor and the check-in form offer them back. */
export function deferredOffers(rows: Awaited<ReturnType<typeof deferredLinesForUnit>>) {
  return rows.map(({ estimate_lines: l, work_orders: w }) => ({
    id: l.id,
    description: l.description,
    amountCents: lineAmountCents(l.quantityMilli, l.unitPriceCents),
    state: l.state as "held" | "declined",
    woLabel: workOrderLabel(w.number),
    decidedAt: l.updatedAt,
  }));
}

/** Everything the shop's work-order page shows, in one place. */
export async function loadShopWorkOrderPage(user: SessionUser, id: string) {
  const view = await workOrderView(user, id);
  if (!view) return null;
  const db = getDb();
  const [shop, rates, [account], deferred, time] = await Promise.all([
    getShopSettings(),
    db.select().from(laborRates).where(eq(laborRates.active, true)).orderBy(asc(laborRates.position)),
    db.select().from(accounts).where(eq(accounts.id, view.accountId)).limit(1),
    deferredLinesForUnit(db, view.unitId, view.id),
    timeSummary(view.id),
  ]);
  const taxDefaults: Record<LineKind, boolean> = { labor: shop.taxLabor, part: shop.taxParts, sublet: shop.taxSublet, fee: shop.taxFees };
  return {
    view,
    rates: rates.map((r) => ({ id: r.id, name: r.name, rateCents: r.rateCents, isDefault: r.isDefault })),
    taxDefaults,
    shop: toShopSettings(shop),
    account: toAccountSettings(account!),
    taxExempt: account!.taxExempt,
    deferred: deferredOffers(deferred),
    // Extension lines fold into the diagnosis line they extend: one clock, one box.
    clockLines: view.lines
      .filter((l) => !l.extendsLineId)
      .map((l) => {
        const extensions = view.lines.filter((x) => x.extendsLineId === l.id);
        return {
          id: l.id,
          description: l.description,
          kind: l.kind,
          state: l.state,
          isDiagnosis: l.isDiagnosis,
          approvedMilli: [l, ...extensions].reduce((sum, x) => sum + (isApprovedState(x.state) ? Math.round(x.quantity * 1000) : 0), 0),
          pendingMilli: extensions.filter((x) => x.state === "proposed" || x.state === "draft").reduce((sum, x) => sum + Math.round(x.quantity * 1000), 0),
          spans: time.get(l.id)?.spans ?? [],
        };
      }),
    /** The server's clock when the page was drawn: the browser's first render uses it too (no hydration mismatch). */
    renderedAt: Date.now(),
  };
}
