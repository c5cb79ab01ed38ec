// Which visits still wait to be invoiced is kept on the visit (work_orders.nothing_to_bill,
// db/queries/billing-state.ts), so "ready to invoice" and "waiting for a PO" read only those
// rather than every past visit (issue 13). The flag is checked here against the truth it caches,
// written out again in SQL: a live (not void) invoice, or a released visit with no approved,
// started or finished line (product.md "Invoices and payments": a visit is invoiced from its done
// lines; issue 9: a released visit takes no more decisions).
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { eq, sql } from "drizzle-orm";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, describe, expect, it } from "vitest";
import { getDb, openDatabase, type Reader } from "@/db/client";
import { issueInvoice, markLinesDone } from "@/db/queries/invoice-issue";
import { readyToInvoice } from "@/db/queries/invoice-pages";
import { voidInvoice } from "@/db/queries/payments";
import { moveStatus } from "@/db/queries/status-writes";
import { units, workOrders } from "@/db/schema";
import { asUser, setLines } from "./helpers/billing";
import { COMMITTED_MIGRATIONS, migrationsUpTo } from "./helpers/migrations";

const TRUTH = sql`
  exists (select 1 from invoices i where i.work_order_id = w.id and i.status <> 'void')
  or (w.status = 'released' and not exists (
    select 1 from estimate_lines l where l.work_order_id = w.id and l.state in ('approved', 'in_progress', 'done')))`;

/** Work orders whose flag differs from the truth (none, when the app kept it). */
async function drifted(db: Reader): Promise<unknown[]> {
  return db.all(sql`select w.number, w.nothing_to_bill as flag from work_orders w where w.nothing_to_bill <> (${TRUTH})`);
}

/** The "ready to invoice" list worked out by reading every visit, without the flag. */
async function readyByFullScan(): Promise<number[]> {
  const rows = await getDb().all<{ number: number }>(sql`
    select w.number from work_orders w
    where w.status in ('final_check', 'ready', 'released')
      and exists (select 1 from estimate_lines l where l.work_order_id = w.id and l.state = 'done')
      and not exists (select 1 from invoices i where i.work_order_id = w.id and i.status <> 'void')
    order by w.number desc`);
  return rows.map((r) => r.number);
}

async function unitWithNoOpenVisit(): Promise<{ id: string; accountId: string }> {
  const [unit] = await getDb()
    .select({ id: units.id, accountId: units.accountId })
    .from(units)
    .where(sql`not exists (select 1 from work_orders w where w.unit_id = ${units.id} and w.status <> 'released') and ${units.retiredAt} is null`)
    .limit(1);
  if (!unit) throw new Error("every demo unit is in the shop");
  return unit;
}

async function flagOf(workOrderId: string): Promise<boolean> {
  const [row] = await getDb().select({ flag: workOrders.nothingToBill }).from(workOrders).where(eq(workOrders.id, workOrderId));
  return row!.flag;
}

describe("which visits wait to be invoiced (work_orders.nothing_to_bill)", () => {
  it("matches the truth on the demo data, and the list matches a full scan", async () => {
    expect(await drifted(getDb())).toEqual([]);
    const owner = await asUser("owner@quarry-road.example");
    const listed = (await readyToInvoice(owner)).map((r) => r.number);
    expect(listed.length).toBeGreaterThan(0);
    expect(listed).toEqual(await readyByFullScan());
  });

  it("follows issuing, voiding and issuing again", async () => {
    const writer = await asUser("writer@quarry-road.example");
    const ready = await readyToInvoice(writer);
    // One that needs no PO, so it can be issued as it is.
    const wo = ready.find((r) => !r.needsPo)!;
    expect(await flagOf(wo.id)).toBe(false);

    const first = await issueInvoice(writer, wo.id, {});
    expect(await flagOf(wo.id)).toBe(true);
    expect((await readyToInvoice(writer)).map((r) => r.id)).not.toContain(wo.id);

    await voidInvoice(writer, first.id, "Wrong labour rate.");
    expect(await flagOf(wo.id)).toBe(false);
    expect((await readyToInvoice(writer)).map((r) => r.id)).toContain(wo.id);

    await issueInvoice(writer, wo.id, {});
    expect(await flagOf(wo.id)).toBe(true);
    expect(await drifted(getDb())).toEqual([]);
  });

  it("settles a visit released with nothing approved, and keeps one released with approved work waiting", async () => {
    const writer = await asUser("writer@quarry-road.example");
    const visit = async (number: number, state: "proposed" | "approved") => {
      const unit = await unitWithNoOpenVisit();
      const [wo] = await getDb()
        .insert(workOrders)
        .values({ number, unitId: unit.id, accountId: unit.accountId, status: "final_check", title: "Test visit", openedAt: new Date().toISOString() })
        .returning();
      const [lineId] = await setLines(wo!.id, [{ kind: "labor", description: "Inspect", quantityMilli: 1000, unitPriceCents: 12_000, state }]);
      return { id: wo!.id, lineId: lineId! };
    };

    const declined = await visit(9101, "proposed");
    await moveStatus(writer, declined.id, { status: "released", note: "", pendingLines: "decline", pendingNote: "Not wanted this time." });
    expect(await flagOf(declined.id)).toBe(true);

    const approved = await visit(9102, "approved");
    await moveStatus(writer, approved.id, { status: "released", note: "" });
    expect(await flagOf(approved.id)).toBe(false);
    expect((await readyToInvoice(writer)).map((r) => r.id)).not.toContain(approved.id);
    // Finished after the release, from the invoice screen: now it waits to be invoiced.
    await markLinesDone(writer, approved.id, [approved.lineId]);
    expect((await readyToInvoice(writer)).map((r) => r.id)).toContain(approved.id);
    expect(await drifted(getDb())).toEqual([]);
  });
});

describe("migration 0009 on a database that already holds visits", () => {
  const dir = mkdtempSync(path.join(tmpdir(), "cotter-billing-state-"));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  /** The committed migrations as they stood before the flag (0000–0008). */
  function migrationsBefore(): string {
    const { folder, lastTag } = migrationsUpTo(dir, 8);
    expect(lastTag).toBe("0008_list_indexes");
    return folder;
  }

  it("sets the flag from the invoices and lines already there", async () => {
    const { client, db } = openDatabase(`file:${path.join(dir, "cotter.db")}`);
    try {
      await migrate(db, { migrationsFolder: migrationsBefore() });
      await client.execute("INSERT INTO accounts (id, name) VALUES ('acct', 'Existing fleet')");
      const visit = async (n: number, status: string, lineState: string | null, invoice: "open" | "void" | null) => {
        await client.execute(`INSERT INTO units (id, account_id, unit_number, description) VALUES ('u${n}', 'acct', '${n}', 'Plow truck')`);
        await client.execute(`INSERT INTO work_orders (id, number, unit_id, account_id, status, opened_at) VALUES ('wo${n}', ${n}, 'u${n}', 'acct', '${status}', '2025-01-01T12:00:00Z')`);
        if (lineState) {
          await client.execute(`INSERT INTO estimate_lines (id, work_order_id, kind, description, quantity_milli, unit_price_cents, state) VALUES ('l${n}', 'wo${n}', 'part', 'Part', 1000, 5000, '${lineState}')`);
        }
        if (invoice) {
          await client.execute(
            `INSERT INTO invoices (id, number, work_order_id, account_id, status, bill_to, shop_snapshot, unit_snapshot, tax_rate_milli_pct, terms_days, issued_at, due_on, total_cents)
             VALUES ('i${n}', ${n}, 'wo${n}', 'acct', '${invoice}', '{}', '{}', '{}', 0, 30, '2025-01-02T12:00:00Z', '2025-02-01', 5000)`,
          );
        }
      };
      await visit(1, "released", "done", "open"); // invoiced: settled
      await visit(2, "released", "done", "void"); // invoice voided: waits again
      await visit(3, "released", "declined", null); // released with nothing approved: settled
      await visit(4, "released", "approved", null); // approved work not yet finished: waits
      await visit(5, "repairing", null, null); // still in the shop: waits

      await migrate(db, { migrationsFolder: COMMITTED_MIGRATIONS });
      const rows = await client.execute("SELECT number, nothing_to_bill AS flag FROM work_orders ORDER BY number");
      expect(rows.rows.map((r) => [Number(r.number), Number(r.flag)])).toEqual([[1, 1], [2, 0], [3, 1], [4, 0], [5, 0]]);
      expect(await drifted(db)).toEqual([]);
    } finally {
      client.close();
    }
  });
});
