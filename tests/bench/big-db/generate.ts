/**
 * The big database: the demo data (db/seed) grown to what a busy shop holds
 * after years. 200 accounts, 5,000 units, 50,000 work orders (625 open),
 * 400,000 estimate lines, 400,000 decisions, 50,000 invoices; Brennan
 * Township with 1,000 units and 10,000 past visits, a 250-line visit waiting
 * on approval, and visits full of small proposed lines for the approvals
 * benchmark. Everything invented; seeded, so every run writes the same data.
 *
 * Run: npm run bench:db -- [--out tests/.artifacts/bench/big.db]
 */
import { writeFileSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { createClient } from "@libsql/client";
import { eq, sql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/libsql";
import { budgetUsedCents, currentFiscalYear } from "@/db/queries/estimate-context";
import * as schema from "@/db/schema";
import { env } from "@/lib/env";
import { BulkWriter } from "./bulk";
import { readDemo, unitsInShop } from "./demo";
import { InvoiceWriter } from "./invoices";
import { writeBigVisit, writeOpenVisit, writePoolVisit, type PoolLine } from "./open-visits";
import { planVisits } from "./plan";
import { Rng } from "./rng";
import { writePastVisit, type VisitContext } from "./visit-writer";
import { prepareDemoFile } from "./prepare";
import { addAccounts, addUnits } from "./world";

export const TARGETS = {
  accounts: 200,
  units: 5_000,
  workOrders: 50_000,
  open: 625,
  lines: 400_000,
  decisions: 400_000,
  invoices: 50_000,
  townshipUnits: 1_000,
  townshipPast: 10_000,
  // 200 visits × 61 lines: 12,000 proposed lines to approve, ~$3,000 a visit.
  townshipOpen: 240,
  poolVisits: 200,
  poolLinesPerVisit: 61,
};

/** What the benchmark needs to find in the big database. */
export interface BigManifest {
  seconds: number;
  townshipId: string;
  bigVisitId: string;
  pool: PoolLine[];
  counts: Record<string, number>;
}

export async function generateBigDatabase(url: string, log: (line: string) => void = () => {}): Promise<BigManifest> {
  const started = performance.now();
  const client = createClient({ url, concurrency: 1 });
  const db = drizzle(client, { schema });
  try {
    // A bulk load: no journal, no fsync, a big page cache, one connection holding the file.
    for (const p of ["journal_mode = OFF", "synchronous = OFF", "cache_size = -1000000", "temp_store = MEMORY", "locking_mode = EXCLUSIVE", "foreign_keys = OFF"]) {
      await client.execute(`PRAGMA ${p}`);
    }
    const rng = new Rng(20_261_130);
    const now = Date.now();
    const demo = await readDemo(db);
    const inShop = await unitsInShop(db);
    // Indexes are built once over the loaded rows (faster than growing them row by row), from the migrations' own SQL.
    const indexes = await client.execute("SELECT name, sql FROM sqlite_master WHERE type = 'index' AND sql IS NOT NULL");
    for (const row of indexes.rows) await client.execute(`DROP INDEX "${String(row.name)}"`);
    const w = new BulkWriter(client);
    const accounts = await addAccounts(w, rng, demo, TARGETS.accounts, now);
    const units = await addUnits(w, rng, demo, accounts, { totalUnits: TARGETS.units, townshipUnits: TARGETS.townshipUnits }, now);
    const visits = planVisits(rng, { accounts, units, inShop }, TARGETS, { ...demo.counts, lastNumber: demo.counters.workOrder }, now);
    const past = visits.filter((v) => v.kind === "past");
    const s = demo.shop;
    const invoicesWriter = new InvoiceWriter(
      w, rng, now,
      { ...s, name: s.shopName, addressLines: [s.addressLine1, s.addressLine2].filter(Boolean), footer: s.invoiceFooter },
      { writer: demo.staff.writer }, env().APP_TIME_ZONE,
      TARGETS.invoices - demo.counts.invoices - past.length, past.length,
    );
    const ctx: VisitContext = {
      w, rng, now, demo, invoices: invoicesWriter,
      left: { lines: TARGETS.lines - demo.counts.lines, decisions: TARGETS.decisions - demo.counts.decisions, pastVisits: past.length },
    };
    const pool: PoolLine[] = [];
    let bigVisitId = "";
    // Open visits first (their lines are fixed), then the history takes what is left of the totals.
    for (const v of visits) {
      if (v.kind === "big") {
        bigVisitId = v.id;
        await writeBigVisit(ctx, v);
      } else if (v.kind === "pool") {
        const approver = demo.township.approvers[pool.length % 2 === 0 ? 0 : 1]!;
        pool.push(...(await writePoolVisit(ctx, v, TARGETS.poolLinesPerVisit, approver.id)));
      } else if (v.kind === "open") await writeOpenVisit(ctx, v);
    }
    for (const v of past) await writePastVisit(ctx, v);
    const lastInvoice = await invoicesWriter.finish(demo.counters.invoice);
    await w.commit();
    const indexed = performance.now();
    for (const row of indexes.rows) await client.execute(String(row.sql));
    log(`  indexes rebuilt in ${((performance.now() - indexed) / 1000).toFixed(1)} s`);
    await client.execute({ sql: "UPDATE counters SET value = ? WHERE name = 'work_order'", args: [visits.at(-1)?.number ?? demo.counters.workOrder] });
    await client.execute({ sql: "UPDATE counters SET value = ? WHERE name = 'invoice'", args: [lastInvoice] });
    log(`  rows written in ${((performance.now() - started) / 1000).toFixed(1)} s`);

    await setBudgets(db, accounts, demo.township.id);
    await client.execute("PRAGMA journal_mode = WAL");
    const counts: Record<string, number> = {};
    for (const table of ["accounts", "units", "work_orders", "estimate_lines", "decisions", "invoices", "invoice_lines", "payments", "status_events", "meter_readings", "findings"]) {
      const r = await client.execute(`SELECT count(*) AS n FROM ${table}`);
      counts[table] = Number(r.rows[0]?.n ?? 0);
    }
    const open = await client.execute("SELECT count(*) AS n FROM work_orders WHERE status <> 'released'");
    counts.open_work_orders = Number(open.rows[0]?.n ?? 0);
    const tw = await client.execute({ sql: "SELECT count(*) AS n FROM work_orders WHERE account_id = ? AND status = 'released'", args: [demo.township.id] });
    counts.township_past_visits = Number(tw.rows[0]?.n ?? 0);
    const tu = await client.execute({ sql: "SELECT count(*) AS n FROM units WHERE account_id = ?", args: [demo.township.id] });
    counts.township_units = Number(tu.rows[0]?.n ?? 0);
    return { seconds: (performance.now() - started) / 1000, townshipId: demo.township.id, bigVisitId, pool, counts };
  } finally {
    client.close();
  }
}

/**
 * Repair budgets from what the history spent this fiscal year, counted by
 * the app's own budget query: public fleets get a budget with room to spare,
 * the township enough for every approval the benchmark makes, the demo's
 * school district its story (about $1,100 left, so its brake lines are
 * refused), and private companies none.
 */
async function setBudgets(db: ReturnType<typeof drizzle<typeof schema>>, all: { id: string; kind: string; demo: boolean; fiscalYearStartMonth: number }[], townshipId: string) {
  const [room] = await db
    .select({ cents: sql<number>`coalesce(sum(${schema.estimateLines.quantityMilli} * ${schema.estimateLines.unitPriceCents} / 1000.0), 0)` })
    .from(schema.estimateLines)
    .innerJoin(schema.workOrders, eq(schema.workOrders.id, schema.estimateLines.workOrderId))
    .where(sql`${schema.workOrders.accountId} = ${townshipId} and ${schema.estimateLines.state} = 'proposed'`);
  for (const a of all) {
    if (a.kind === "aggregates") continue;
    const used = await budgetUsedCents(db, a.id, currentFiscalYear(a));
    let budget: number;
    if (a.id === townshipId) budget = Math.ceil((used + Number(room?.cents ?? 0) * 1.1 + 5_000_000) / 10_000_000) * 10_000_000;
    else if (a.demo) budget = Math.ceil((used + 110_000) / 50_000) * 50_000;
    else budget = Math.max(2_000_000, Math.ceil((used * 1.3) / 1_000_000) * 1_000_000);
    await db.update(schema.accounts).set({ repairBudgetCents: budget }).where(eq(schema.accounts.id, a.id));
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const outArg = process.argv.indexOf("--out");
  const file = path.resolve(outArg > 0 ? process.argv[outArg + 1]! : "tests/.artifacts/bench/big.db");
  const seeded = prepareDemoFile(file);
  console.log(`demo database (migrated and seeded) in ${seeded.toFixed(1)} s`);
  const manifest = await generateBigDatabase(`file:${file}`, console.log);
  writeFileSync(file.replace(/\.db$/, ".json"), JSON.stringify(manifest));
  console.log(`big database at ${file} in ${manifest.seconds.toFixed(1)} s`, manifest.counts);
}
