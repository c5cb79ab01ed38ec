// Migration 0007 adds the repair budget's running total (account_budget_use) to a database
// that already holds approvals. It writes no rows (a fiscal year's bounds need the shop's time
// zone, which SQL cannot apply); reads recount until the first write of a fiscal year makes its
// row from the recount, so the totals an existing database shows and checks are right at once.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { sql } from "drizzle-orm";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import { budgetUsedCents, budgetUsedForWrite, moveBudgetUse, recountBudgetUsed } from "@/db/queries/budget-use";
import { currentFiscalYear } from "@/db/queries/estimate-context";
import { COMMITTED_MIGRATIONS, migrationsUpTo } from "./helpers/migrations";

const dir = mkdtempSync(path.join(tmpdir(), "cotter-budget-use-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The committed migrations as they stood before the running total (0000–0006). */
function migrationsBefore(): string {
  const { folder, lastTag } = migrationsUpTo(dir, 6);
  expect(lastTag).toBe("0006_unit_search");
  return folder;
}

describe("account_budget_use (migration 0007)", () => {
  it("gives an existing database the right totals: recounted on read, made from the recount on the first write, then kept", async () => {
    const { client, db } = openDatabase(`file:${path.join(dir, "cotter.db")}`);
    try {
      await migrate(db, { migrationsFolder: migrationsBefore() });
      const bounds = currentFiscalYear({ fiscalYearStartMonth: 1 });
      const inYear = new Date(Date.parse(bounds.fromIso) + 3_600_000).toISOString();
      const before = new Date(Date.parse(bounds.fromIso) - 3_600_000).toISOString();
      await client.execute("INSERT INTO accounts (id, name, fiscal_year_start_month) VALUES ('acct', 'Existing fleet', 1)");
      await client.execute("INSERT INTO units (id, account_id, unit_number, description) VALUES ('u', 'acct', '12', 'Plow truck')");
      await client.execute(`INSERT INTO work_orders (id, number, unit_id, account_id, opened_at) VALUES ('wo', 1, 'u', 'acct', '${before}')`);
      const line = (id: string, state: string, cents: number, at: string | null) =>
        client.execute({
          sql: "INSERT INTO estimate_lines (id, work_order_id, kind, description, quantity_milli, unit_price_cents, state, approved_amount_cents, approved_at) VALUES (?, 'wo', 'part', ?, 1000, ?, ?, ?, ?)",
          args: [id, id, cents, state, at ? cents : null, at],
        });
      await line("a", "approved", 120_000, inYear);
      await line("b", "done", 30_000, inYear);
      await line("credit", "approved", -5_000, inYear); // a credit counts as zero
      await line("last-year", "done", 70_000, before);
      await line("waiting", "proposed", 9_000, null);

      await migrate(db, { migrationsFolder: COMMITTED_MIGRATIONS });
      expect((await client.execute("SELECT count(*) AS n FROM account_budget_use")).rows[0]).toMatchObject({ n: 0 });
      expect(await recountBudgetUsed(db, "acct", bounds)).toBe(150_000);
      expect(await budgetUsedCents(db, "acct", bounds)).toBe(150_000);

      // The first write of the fiscal year makes the row from the recount; later changes move it.
      await db.transaction(async (tx) => {
        expect(await budgetUsedForWrite(tx, "acct", { ...bounds, label: bounds.fy.label })).toBe(150_000);
        await tx.run(sql`UPDATE estimate_lines SET state = 'approved', approved_amount_cents = 9000, approved_at = ${inYear} WHERE id = 'waiting'`);
        await moveBudgetUse(tx, "acct", [{ before: { state: "proposed", approvedAt: null, approvedAmountCents: null }, after: { state: "approved", approvedAt: inYear, approvedAmountCents: 9_000 } }]);
      });
      const [row] = (await client.execute("SELECT * FROM account_budget_use")).rows;
      expect(row).toMatchObject({ account_id: "acct", from_at: bounds.fromIso, to_at: bounds.toIso, fiscal_year: bounds.fy.label, used_cents: 159_000 });
      expect(await budgetUsedCents(db, "acct", bounds)).toBe(await recountBudgetUsed(db, "acct", bounds));
      expect((await client.execute("PRAGMA foreign_key_check")).rows).toHaveLength(0);
    } finally {
      client.close();
    }
  });
});
