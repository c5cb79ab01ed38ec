/**
 * Unit search on a SQLite file with 20,000 units (demo data plus invented
 * units): any 5 characters of a VIN through listUnits (the FTS5 trigram index
 * of drizzle/0003_unit_search.sql), beside the same question asked as a
 * LIKE '%…%' scan of the units table, for comparison. Importing the units
 * from CSV is timed too (500 rows, the largest fleet list, all or none).
 * Run: npx tsx tests/bench/unit-search-bench.ts
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

const UNITS = 20_000;
const QUERIES = 200;

const { closeDb, getClient, getDb } = await import("../../db/client");
const { migrateDatabase } = await import("../../db/migrate");
const { seedDatabase } = await import("../../db/seed");
const { accounts, units, users } = await import("../../db/schema");
const { listUnits } = await import("../../db/queries/units");
const { importUnits } = await import("../../db/queries/unit-writes");
const { withCheckDigit } = await import("../../lib/vin");

await migrateDatabase(url);
await seedDatabase(url, { photos: false });
const db = getDb();
const [account] = await db.select().from(accounts).where(eq(accounts.name, "Kettle Ridge Stone Co."));
const [writer] = await db.select().from(users).where(eq(users.email, "writer@quarry-road.example"));
if (!account || !writer) throw new Error("demo data missing");
const user = { id: writer.id, name: writer.name, email: writer.email, role: writer.role, accountId: null, signingLimitCents: null, via: "session" as const };

// Invented VINs: the unassigned "0CT" prefix, a serial in positions 12–17.
const vin = (n: number) => withCheckDigit(`0CTBX${String(n % 100).padStart(2, "0")}10NA${String(n).padStart(6, "0")}`);
for (let start = 0; start < UNITS; start += 1000) {
  await db.insert(units).values(
    Array.from({ length: 1000 }, (_, i) => {
      const n = start + i;
      return { accountId: account.id, unitNumber: `B-${n}`, vin: vin(n), description: `Bench unit ${n}`, plate: `BX-${n}` };
    }),
  );
}

const fragments = Array.from({ length: QUERIES }, (_, i) => vin((i * 97) % UNITS).slice(11, 16));
const timeIt = async (fn: (q: string) => Promise<unknown>) => {
  const out: number[] = [];
  for (const q of fragments) {
    const t = performance.now();
    await fn(q);
    out.push(performance.now() - t);
  }
  return out;
};

const fts = await timeIt((q) => listUnits(user, { limit: 50, q }));
const like = await timeIt((q) => getClient().execute({ sql: "select id from units where vin like ? and retired_at is null order by unit_number limit 51", args: [`%${q}%`] }));

const header = "unitNumber,vin,description,plate";
const rows = Array.from({ length: 500 }, (_, i) => `I-${i},${vin(UNITS + i)},Imported unit ${i},IX-${i}`);
const t = performance.now();
const { imported } = await importUnits(user, account.id, [header, ...rows].join("\n"));
const importMs = performance.now() - t;

console.log(`Unit search, ${UNITS.toLocaleString("en-US")} units plus the demo's, ${QUERIES} VIN fragments of 5 characters:`);
console.log(summary("listUnits through the trigram index", fts));
console.log(summary("the same as LIKE '%…%' (a scan, for comparison)", like));
console.log(`CSV import of ${imported} units, checked and written in one transaction: ${importMs.toFixed(0)} ms`);

closeDb();
rmSync(dir, { recursive: true, force: true });
