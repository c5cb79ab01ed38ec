/**
 * Prices and checks a 500-line work order: pricing, one batch decision over
 * every line (approvals counted against signing limit and budget), and the
 * API limits view. Run: npx tsx tests/bench/estimate-bench.ts
 */
import { performance } from "node:perf_hooks";
import {
  decideLines,
  fiscalYearOf,
  limitsView,
  priceEstimate,
  type AccountSettings,
  type DecisionRequest,
  type EstimateLine,
  type LineKind,
  type ShopSettings,
} from "../../lib/estimate";
import { summary } from "./stats";

const LINES = 500;
const WARMUP = 2_000;
const ITERATIONS = 10_000;

const kinds: LineKind[] = ["labor", "part", "part", "sublet", "fee"];
const lines: EstimateLine[] = Array.from({ length: LINES }, (_, i) => {
  const kind = kinds[i % kinds.length] ?? "part";
  return {
    id: `L-${i}`,
    kind,
    quantityMilli: kind === "labor" ? 100 * (1 + (i % 40)) : 250 * (1 + (i % 16)),
    unitPriceCents: kind === "labor" ? 14_250 : 1_899 + 37 * i,
    taxable: kind !== "labor",
    coreChargeCents: kind === "part" && i % 3 === 0 ? 4_500 : 0,
    state: "proposed",
    version: 1 + (i % 4),
    approvedByUserId: null,
    byStanding: false,
    approvedAmountCents: null,
    isDiagnosis: i === 0,
  };
});

const shop: ShopSettings = { shopSuppliesRateMilliPct: 8_000, shopSuppliesCapCents: 5_000, shopSuppliesTaxable: true };
const account: AccountSettings = {
  taxExempt: false,
  taxRateMilliPct: 6_250,
  shopSuppliesExempt: false,
  standingAuthorisationCents: 25_000,
  repairBudgetCents: 1_000_000_000,
  fiscalYearStartMonth: 7,
  overrunPercentMilli: 10_000,
  overrunCapCents: 5_000,
  overrunFloorCents: 0,
};
const caller = { id: "u-approver", signingLimitCents: 1_000_000_000 };
const fiscalYear = fiscalYearOf("2026-12-01", account.fiscalYearStartMonth);
// Mostly approvals, so every limit check runs; a few declines and holds.
const decisions: DecisionRequest[] = lines.map((l, i) => ({
  lineId: l.id,
  decision: i % 10 === 9 ? "decline" : i % 10 === 8 ? "hold" : "approve",
  expectedVersion: l.version,
}));

let sink = 0;
function once(): void {
  const before = priceEstimate(lines, shop, account);
  const result = decideLines({
    workOrderNumber: "W-1042",
    lines,
    caller,
    shop,
    account,
    budgetUsedCents: 12_345_600,
    fiscalYear,
    decisions,
  });
  if (!result.ok) throw new Error(`batch refused: ${result.code}`);
  const limits = limitsView({ lines: result.lines, account, caller, budgetUsedCents: 12_345_600 });
  sink += before.totals.pendingCents + result.totals.grandTotalCents + (limits.signingUsedCents ?? 0);
}

for (let i = 0; i < WARMUP; i++) once();
// Wall time includes waiting for a CPU on a busy machine; process CPU time
// (microsecond resolution) does not, so both are shown.
const wall: number[] = [];
const cpu: number[] = [];
for (let i = 0; i < ITERATIONS; i++) {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  once();
  wall.push(performance.now() - t0);
  const c = process.cpuUsage(c0);
  cpu.push((c.user + c.system) / 1000);
}
console.log(`estimate bench: ${LINES}-line work order, ${ITERATIONS} iterations after ${WARMUP} warm-up`);
console.log("  per work order: pricing + batch decision over all lines + limits (target < 1 ms)");
console.log(summary("wall", wall));
console.log(summary("cpu ", cpu));
if (sink === 0) console.log("unexpected zero totals");
