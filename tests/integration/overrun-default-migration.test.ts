// The default overrun allowance for a new account is the Florida shape with its floor
// (Florida Statutes 559.909(1)(b), as reference-values.md reads it: the greater of $10 or 10 %,
// never more than $50). The migration changes only the column default: accounts that exist keep
// what they have, and nothing that hangs off an account is lost while the table is rebuilt.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { migrate } from "drizzle-orm/libsql/migrator";
import { afterAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import { COMMITTED_MIGRATIONS, migrationsUpTo } from "./helpers/migrations";

const dir = mkdtempSync(path.join(tmpdir(), "cotter-overrun-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The committed migrations as they stood before the default changed (0000 and 0001 only). */
function migrationsBefore(): string {
  const { folder, lastTag } = migrationsUpTo(dir, 1);
  expect(lastTag).toBe("0001_credit_notes");
  return folder;
}

describe("overrun allowance default (migration)", () => {
  it("gives a new account the Florida shape ($10 floor, 10 %, $50 cap) and leaves existing accounts and their rows alone", async () => {
    const { client, db } = openDatabase(`file:${path.join(dir, "cotter.db")}`);
    try {
      await migrate(db, { migrationsFolder: migrationsBefore() });
      // An account made under the old default (no floor), with a contact and a person hanging off it.
      await client.execute("INSERT INTO accounts (id, name) VALUES ('old', 'Existing fleet')");
      await client.execute("INSERT INTO account_contacts (id, account_id, name) VALUES ('c1', 'old', 'Fleet contact')");
      await client.execute(
        "INSERT INTO users (id, email, name, password_hash, role, account_id) VALUES ('u1', 'approver@existing.example', 'Approver', 'x', 'approver', 'old')",
      );
      const before = (await client.execute("SELECT * FROM accounts WHERE id = 'old'")).rows[0];
      expect(before).toMatchObject({ overrun_percent_milli: 10_000, overrun_cap_cents: 5_000, overrun_floor_cents: 0 });

      await migrate(db, { migrationsFolder: COMMITTED_MIGRATIONS });

      // Every column the account had keeps its value (later migrations may add columns of their own).
      const after = (await client.execute("SELECT * FROM accounts WHERE id = 'old'")).rows[0]!;
      expect(Object.fromEntries(Object.keys(before!).map((k) => [k, after[k]]))).toEqual({ ...before });
      expect((await client.execute("SELECT count(*) AS n FROM account_contacts WHERE account_id = 'old'")).rows[0]).toMatchObject({ n: 1 });
      expect((await client.execute("SELECT account_id FROM users WHERE id = 'u1'")).rows[0]).toMatchObject({ account_id: "old" });
      expect((await client.execute("PRAGMA foreign_key_check")).rows).toHaveLength(0);

      await client.execute("INSERT INTO accounts (id, name) VALUES ('new', 'New fleet')");
      expect((await client.execute("SELECT overrun_percent_milli, overrun_cap_cents, overrun_floor_cents FROM accounts WHERE id = 'new'")).rows[0]).toMatchObject({
        overrun_percent_milli: 10_000,
        overrun_cap_cents: 5_000,
        overrun_floor_cents: 1_000,
      });
    } finally {
      client.close();
    }
  });
});
