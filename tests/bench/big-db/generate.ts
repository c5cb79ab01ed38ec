/**
 * The big database: the demo data (db/seed) grown to what a busy shop holds
 * after years. 200 accounts, 5,000 units, 50,000 work orders (625 open),
 * 400,000 estimate lines, 400,000 decisions, 50,000 invoices; Brennan
 * Township with 1,000 units and 10,000 past visits, a 250-line visit waiting
 * on approval, and visits full of small proposed lines for the approvals
 * benchmark. Everything invented; seeded, so every run writes the same data.
 *
 * Run: npm run bench:db -- [--scale big|demo] [--out tests/.artifacts/bench/big.db]
 * (`--scale demo`: the demo data plus only the township's 250-line visit.)
 */
import { writeFileSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { createClient } from "@libsql/client";
import { eq, sql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/libsql";
import { settleNothingToBill } from "@/db/queries/billing-state";
import { budgetUsedCents, rebuildBudgetUse } from "@/db/queries/budget-use";
import { currentFiscalYear } from "@/db/queries/estimate-context";
import * as schema from "@/db/schema";
import { env } from "@/lib/env";
import { BulkWriter } from "./bulk";
import { readDemo, unitsInShop, type DemoWorld } from "./demo";
import { InvoiceWriter } from "./invoices";
import { writeBigVisit, writeOpenVisit, writePoolVisit, type PoolLine } from "./open-visits";
import { planVisits } from "./plan";
import { Rng } from "./rng";
import { writePastVisit, type VisitContext } from "./visit-writer";
import { prepareDemoFile } from "./prepare";
import { addAccounts, addUnits } from "./world";

export type Targets = typeof BIG;

/** The big database of issue 13. */
export const BIG = {
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

/**
 * The demo data with nothing added but the township's 250-line visit (built
 * from the same seed as the big database's), so the approval page can be
 * compared across the two databases.
 */
export function demoWithBigVisit(demo: DemoWorld): Targets {
  const townshipUnits = demo.units.filter((u) => u.accountId === demo.township.id);
  return {
    accounts: demo.accounts.length, units: demo.units.length, workOrders: demo.counts.workOrders + 1, open: demo.counts.open + 1,
    lines: demo.counts.lines, decisions: demo.counts.decisions, invoices: demo.counts.invoices,
    townshipUnits: townshipUnits.length, townshipPast: demo.counts.townshipReleased, townshipOpen: demo.counts.townshipOpen + 1,
    poolVisits: 0, poolLinesPerVisit: 0,
  };
}

export type Scale = "big" | "demo";

/** Where the command line writes a database's manifest. */
export function manifestFile(dbFile: string): string {
  return dbFile.replace(/\.db$/, ".json");
}

/** What the benchmark needs to find in the big database. */
export interface BigManifest {
  seconds: number;
  seededSeconds?: number;
  townshipId: string;
  bigVisitId: string;
  pool: PoolLine[];
  counts: Record<string, number>;
}

export async function generateDatabase(url: string, scale: Scale, log: (line: string) => void = () => {}): Promise<BigManifest> {
  const started = performance.now();
  const client = createClient({ url, concurrency: 1 });
  const db = drizzle(client, { schema });
  try {
    // A bulk load: no journal, no fsync, a big page cache, no foreign-key checks (rows come in any order).
    for (const p of ["journal_mode = OFF", "synchronous = OFF", "cache_size = -1000000", "temp_store = MEMORY", "foreign_keys = OFF"]) {
      await client.execute(`PRAGMA ${p}`);
    }
    const rng = new Rng(20_261_130);
    const now = Date.now();
    const demo = await readDemo(db);
    const inShop = await unitsInShop(db);
    const targets = scale === "big" ? BIG : demoWithBigVisit(demo);
    // Indexes are built once over the loaded rows (faster than growing them row by row), from the migrations' own SQL.
    const indexes = await client.execute("SELECT name, sql FROM sqlite_master WHERE type = 'index' AND sql IS NOT NULL");
    for (const row of indexes.rows) await client.execute(`DROP INDEX "${String(row.name)}"`);
    const w = new BulkWriter(client);
    const accounts = await addAccounts(w, rng, demo, targets.accounts, now);
    const units = await addUnits(w, rng, demo, accounts, { totalUnits: targets.units, townshipUnits: targets.townshipUnits }, now);
    const visits = planVisits(rng, { accounts, units, inShop }, targets, { ...demo.counts, lastNumber: demo.counters.workOrder }, now);
    const past = visits.filter((v) => v.kind === "past");
    const s = demo.shop;
    const invoicesWriter = new InvoiceWriter(
      w, rng, now,
      { ...s, name: s.shopName, addressLines: [s.addressLine1, s.addressLine2].filter(Boolean), footer: s.invoiceFooter },
      { writer: demo.staff.writer }, env().APP_TIME_ZONE,
      targets.invoices - demo.counts.invoices - past.length, past.length,
    );
    const ctx: VisitContext = {
      w, rng, now, demo, invoices: invoicesWriter,
      left: { lines: targets.lines - demo.counts.lines, decisions: targets.decisions - demo.counts.decisions, pastVisits: past.length },
    };
    const pool: PoolLine[] = [];
    let poolVisits = 0;
    let bigVisitId = "";
    // Open visits first (their lines are fixed), then the history takes what is left of the totals.
    for (const v of visits) {
      if (v.kind === "big") {
        bigVisitId = v.id;
        // Its own seed: the same 250 lines whichever database it is written into.
        await writeBigVisit({ ...ctx, rng: new Rng(250) }, v);
      } else if (v.kind === "pool") {
        // Visits alternate between the road supervisor and the trustee.
        const approver = demo.township.approvers[poolVisits++ % 2]!;
        pool.push(...(await writePoolVisit(ctx, v, targets.poolLinesPerVisit, approver.id)));
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

    // The running budget totals, counted again over the history just written (the demo seed's are stale now).
    await rebuildBudgetUse(db, new Date(now));
    // Which visits still wait to be invoiced, from the invoices and lines just written.
    await settleNothingToBill(db);
    // The demo keeps its own budgets; the big database's are set from what its history spent.
    if (scale === "big") await setBudgets(db, accounts, demo.township.id);
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
  const arg = (name: string) => {
    const i = process.argv.indexOf(name);
    return i > 0 ? process.argv[i + 1] : undefined;
  };
  const scale: Scale = arg("--scale") === "demo" ? "demo" : "big";
  const file = path.resolve(arg("--out") ?? `tests/.artifacts/bench/${scale}.db`);
  const seededSeconds = prepareDemoFile(file);
  const manifest = await generateDatabase(`file:${file}`, scale, console.log);
  writeFileSync(manifestFile(file), JSON.stringify({ ...manifest, seededSeconds }));
  console.log(`${scale} database at ${file}: migrated and seeded in ${seededSeconds.toFixed(1)} s, generated in ${manifest.seconds.toFixed(1)} s`);
  console.log(`  ${Object.entries(manifest.counts).map(([k, v]) => `${k} ${v}`).join(", ")}`);
  // The driver keeps a closed connection's file open until its statements are collected; end the process now.
  process.exit(0);
}
