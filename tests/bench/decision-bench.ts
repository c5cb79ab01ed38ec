/**
 * The server path against a real SQLite file (demo data, photos off): one
 * approval written through the full guarded query (load, limit checks, write,
 * timeline, audit; one transaction), one after another and 20 at a time, and
 * the approval page's read (polled every 2.5 s by each open phone).
 * Run: npx tsx tests/bench/decision-bench.ts
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { eq } from "drizzle-orm";
import { summary } from "./stats";

const dir = mkdtempSync(path.join(tmpdir(), "cotter-bench-"));
const url = `file:${path.join(dir, "bench.db")}`;
process.env.DATABASE_URL = url;
process.env.NEXTAUTH_SECRET ??= "bench-secret-bench-secret-bench-secret!!";

const LINES = 40; // a large work order
const SEQUENTIAL = 400;
const CONCURRENT = 400;
const PARALLEL = 20;
const READS = 400;

const { closeDb, getDb } = await import("../../db/client");
const { migrateDatabase } = await import("../../db/migrate");
const { seedDatabase } = await import("../../db/seed");
const { accounts, estimateLines, users, workOrders } = await import("../../db/schema");
const { decide } = await import("../../db/queries/decisions");
const { workOrderView } = await import("../../db/queries/work-order-view");

await migrateDatabase(url);
await seedDatabase(url, { photos: false });
const db = getDb();

const [supervisor] = await db.select().from(users).where(eq(users.email, "supervisor@brennan-twp.example"));
const [wo] = await db.select().from(workOrders).where(eq(workOrders.number, 1042));
if (!supervisor || !wo) throw new Error("demo data missing W-1042 or the supervisor");
// Room for every approval: the bench measures the path, not a refusal.
await db.update(users).set({ signingLimitCents: 1_000_000_000 }).where(eq(users.id, supervisor.id));
await db.update(accounts).set({ repairBudgetCents: 1_000_000_000 }).where(eq(accounts.id, wo.accountId));
await db.insert(estimateLines).values(
  Array.from({ length: LINES }, (_, i) => ({
    workOrderId: wo.id,
    position: 1000 + i,
    kind: i % 3 === 0 ? ("labor" as const) : ("part" as const),
    description: `Bench line ${i + 1}`,
    quantityMilli: 1000 + 100 * (i % 7),
    unitPriceCents: 2_500 + 13 * i,
    taxable: i % 3 !== 0,
    state: "proposed" as const,
  })),
);
const user = {
  id: supervisor.id, name: supervisor.name, email: supervisor.email, role: supervisor.role,
  accountId: supervisor.accountId, signingLimitCents: 1_000_000_000, via: "session" as const,
};

/** The bench lines, put back to proposed between rounds (outside the timing). */
async function proposedBenchLines() {
  const rows = await db.select().from(estimateLines).where(eq(estimateLines.workOrderId, wo!.id));
  const bench = rows.filter((r) => r.description.startsWith("Bench line"));
  for (const r of bench.filter((r) => r.state !== "proposed")) {
    await db.update(estimateLines)
      .set({ state: "proposed", approvedByUserId: null, approvedAmountCents: null, approvedAt: null, version: r.version + 1 })
      .where(eq(estimateLines.id, r.id));
  }
  return (await db.select().from(estimateLines).where(eq(estimateLines.workOrderId, wo!.id)))
    .filter((r) => r.description.startsWith("Bench line"));
}

async function approve(line: { id: string; version: number }): Promise<number> {
  const t0 = performance.now();
  await decide(user, wo!.id, [{ lineId: line.id, decision: "approve", expectedVersion: line.version }]);
  return performance.now() - t0;
}

// Reads first, while the timeline is as long as a real visit's.
const reads: number[] = [];
for (let i = 0; i < READS + 20; i++) {
  const t0 = performance.now();
  const view = await workOrderView(user, wo.id);
  if (!view) throw new Error("approval page read found nothing");
  if (i >= 20) reads.push(performance.now() - t0);
}

// Warm-up: module loading, prepared statements, page cache.
for (const l of (await proposedBenchLines()).slice(0, 10)) await approve(l);

const sequential: number[] = [];
while (sequential.length < SEQUENTIAL) {
  for (const l of await proposedBenchLines()) if (sequential.length < SEQUENTIAL) sequential.push(await approve(l));
}

const concurrent: number[] = [];
let concurrentWall = 0;
while (concurrent.length < CONCURRENT) {
  const lines = await proposedBenchLines();
  for (let i = 0; i + PARALLEL <= lines.length && concurrent.length < CONCURRENT; i += PARALLEL) {
    const t0 = performance.now();
    concurrent.push(...(await Promise.all(lines.slice(i, i + PARALLEL).map(approve))));
    concurrentWall += performance.now() - t0;
  }
}

console.log(`decision bench: SQLite file, demo data, W-1042 with ${LINES} extra proposed lines`);
console.log(`  one approval (load + limits + write + timeline + audit, one transaction), ${SEQUENTIAL} one after another:`);
console.log(summary("latency", sequential));
console.log(`  ${CONCURRENT} approvals, ${PARALLEL} at a time (queued writer):`);
console.log(summary("latency", concurrent));
console.log(`  throughput: ${Math.round((CONCURRENT / concurrentWall) * 1000)} approvals/s`);
console.log(`  approval page read (work order, lines, findings, decisions, limits), ${READS} reads:`);
console.log(summary("latency", reads));

closeDb();
rmSync(dir, { recursive: true, force: true });
