import type { WorkOrderStatus } from "@/lib/domain";
import { bulkId } from "./ids";
import { Rng, unevenSplit } from "./rng";
import { DAY_MS, HISTORY_DAYS, type AccountInfo, type UnitInfo } from "./world";

/**
 * What each generated visit is: a past one (released, invoiced), an open one
 * in some state, one of the township's approval-pool visits (many small
 * proposed lines for the approvals benchmark), or the township's 250-line
 * visit waiting on approval (the approval page benchmark).
 */
export type VisitKind = "past" | "open" | "pool" | "big";

export interface Visit {
  id: string;
  number: number;
  kind: VisitKind;
  status: WorkOrderStatus;
  unit: UnitInfo;
  account: AccountInfo;
  openedAt: number;
}

export interface PlanTargets {
  workOrders: number;
  open: number;
  townshipPast: number;
  townshipOpen: number;
  poolVisits: number;
}

export interface Existing {
  workOrders: number;
  open: number;
  townshipReleased: number;
  lastNumber: number;
}

const OPEN_STATES: WorkOrderStatus[] = ["checked_in", "diagnosing", "waiting_approval", "waiting_approval", "waiting_parts", "repairing", "repairing", "final_check", "ready"];

/** Every generated visit, numbered in the order they were opened (as the counter would have). */
export function planVisits(
  rng: Rng,
  all: { accounts: AccountInfo[]; units: UnitInfo[]; inShop: Set<string> },
  targets: PlanTargets,
  existing: Existing,
  now: number,
): Visit[] {
  const accountOf = new Map(all.accounts.map((a) => [a.id, a]));
  const township = all.accounts.find((a) => a.township)!;
  const townshipUnits = all.units.filter((u) => u.accountId === township.id);
  const otherUnits = all.units.filter((u) => u.accountId !== township.id);
  const visits: Omit<Visit, "number">[] = [];
  // Seconds vary too: nobody checks a truck in on the hour.
  const add = (unit: UnitInfo, kind: VisitKind, status: WorkOrderStatus, openedAt: number) =>
    visits.push({ id: bulkId(), kind, status, unit, account: accountOf.get(unit.accountId)!, openedAt: openedAt - rng.int(0, 3_599) * 1_000 });

  // Open visits first: one per unit, on units the demo does not already have in the shop.
  const free = (units: UnitInfo[]) => units.filter((u) => !all.inShop.has(u.id));
  const townshipOpenNew = targets.townshipOpen - countOpen(all, township.id);
  const townshipPicks = rng.sample(free(townshipUnits), townshipOpenNew);
  const recent = () => now - rng.int(2, 9 * 24) * 3_600_000;
  townshipPicks.forEach((unit, i) => {
    if (i === 0) add(unit, "big", "waiting_approval", now - 2 * DAY_MS);
    else if (i <= targets.poolVisits) add(unit, "pool", "waiting_approval", now - rng.int(1, 4) * DAY_MS);
    else add(unit, "open", rng.pick(OPEN_STATES), recent());
  });
  const otherOpenNew = targets.open - existing.open - townshipOpenNew;
  for (const unit of rng.sample(free(otherUnits), otherOpenNew)) add(unit, "open", rng.pick(OPEN_STATES), recent());

  // Past visits: uneven per unit (some units live in the shop, some hardly come in).
  const pastFor = (units: UnitInfo[], total: number) => {
    const split = unevenSplit(rng, total, units.length, 0);
    units.forEach((unit, i) => {
      for (let k = 0; k < split[i]!; k++) add(unit, "past", "released", now - rng.int(7 * 24, HISTORY_DAYS * 24) * 3_600_000);
    });
  };
  pastFor(townshipUnits, targets.townshipPast - existing.townshipReleased);
  const otherPast = targets.workOrders - targets.open - targets.townshipPast - (existing.workOrders - existing.open - existing.townshipReleased);
  pastFor(otherUnits, otherPast);

  visits.sort((a, b) => a.openedAt - b.openedAt);
  return visits.map((v, i) => ({ ...v, number: existing.lastNumber + 1 + i }));
}

function countOpen(all: { units: UnitInfo[]; inShop: Set<string> }, accountId: string): number {
  return all.units.filter((u) => u.accountId === accountId && all.inShop.has(u.id)).length;
}
