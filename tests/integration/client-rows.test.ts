// The rows the libSQL client hands on, as db/client-rows.ts builds them, answer
// like the client's own (@libsql/client 0.18.0, lib-esm/sqlite3.js `rowFromSql`
// and `valueFromSql` in its default "number" integer mode): values by column
// name (own, enumerable, first of a repeated name wins), by index and length
// (not enumerable), integers as numbers, a RangeError past 2^53, blobs as their
// ArrayBuffer; and drizzle maps them the same, joins with repeated names included.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import { eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/libsql";
import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { installStatementCache } from "@/db/statement-cache";

let dir: string;
let client: Client;

const units = sqliteTable("units", { id: text("id").primaryKey(), number: text("number").notNull(), accountId: text("account_id").notNull() });
const accounts = sqliteTable("accounts", { id: text("id").primaryKey(), name: text("name").notNull(), limitCents: integer("limit_cents") });

beforeAll(async () => {
  installStatementCache();
  dir = mkdtempSync(path.join(tmpdir(), "cotter-rows-"));
  client = createClient({ url: `file:${path.join(dir, "t.db")}` });
  await client.batch([
    "CREATE TABLE accounts (id TEXT PRIMARY KEY, name TEXT NOT NULL, limit_cents INTEGER)",
    "CREATE TABLE units (id TEXT PRIMARY KEY, number TEXT NOT NULL, account_id TEXT NOT NULL)",
    "INSERT INTO accounts VALUES ('a1', 'Township roads', 250000), ('a2', 'School buses', NULL)",
    "INSERT INTO units VALUES ('u1', 'T-14', 'a1'), ('u2', 'B-3', 'a2')",
  ]);
});

afterAll(() => {
  client.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("a row from the client", () => {
  it("answers by name, by index and by length, with only the names as its keys", async () => {
    const { rows, columns } = await client.execute("SELECT id, name, limit_cents FROM accounts ORDER BY id");
    expect(columns).toEqual(["id", "name", "limit_cents"]);
    const [first, second] = rows;
    expect(first).toBeDefined();
    expect([first!.id, first!.name, first!.limit_cents]).toEqual(["a1", "Township roads", 250000]);
    expect([first![0], first![1], first![2], first!.length]).toEqual(["a1", "Township roads", 250000, 3]);
    expect(Object.keys(first!)).toEqual(["id", "name", "limit_cents"]);
    expect(JSON.parse(JSON.stringify(first))).toEqual({ id: "a1", name: "Township roads", limit_cents: 250000 });
    expect(Array.prototype.slice.call(second)).toEqual(["a2", "School buses", null]);
    expect({ ...second }).toEqual({ id: "a2", name: "School buses", limit_cents: null });
    // Built by db/client-rows.ts, not by the client: its index is read through the row's prototype.
    expect(Object.hasOwn(first!, 0)).toBe(false);
  });

  it("keeps the first of two columns of one name by name, and both by index", async () => {
    const { rows } = await client.execute("SELECT u.id, a.id FROM units u JOIN accounts a ON a.id = u.account_id WHERE u.id = 'u1'");
    expect(rows[0]!.id).toBe("u1");
    expect([rows[0]![0], rows[0]![1]]).toEqual(["u1", "a1"]);
    expect(Object.keys(rows[0]!)).toEqual(["id"]);
  });

  it("turns integers, reals, text, null and blobs into what the client would", async () => {
    const { rows } = await client.execute("SELECT 9007199254740991 AS big, -3 AS neg, 2.5 AS real, 'x' AS t, NULL AS n, x'CAFE' AS b");
    const row = rows[0]!;
    expect([row.big, row.neg, row.real, row.t, row.n]).toEqual([Number.MAX_SAFE_INTEGER, -3, 2.5, "x", null]);
    expect(row.b).toBeInstanceOf(ArrayBuffer);
    const blob = row.b as ArrayBuffer;
    expect([...new Uint8Array(blob)].slice(-2)).toEqual([0xca, 0xfe]);
    await expect(client.execute("SELECT 9007199254740993 AS too_big")).rejects.toThrow(RangeError);
  });

  it("is the same row in a transaction and as JSON of the whole result", async () => {
    const tx = await client.transaction("read");
    const inTx = await tx.execute({ sql: "SELECT number FROM units WHERE id = ?", args: ["u2"] });
    tx.close();
    expect(inTx.rows[0]!.number).toBe("B-3");
    expect(inTx.toJSON()).toMatchObject({ columns: ["number"], rows: [["B-3"]] });
  });

  it("stays one wrapper when a second copy of the module installs it (a test runner's set-up loads its own)", async () => {
    vi.resetModules();
    const copy = await import("@/db/statement-cache");
    expect(copy.installStatementCache).not.toBe(installStatementCache);
    copy.installStatementCache();
    const fresh = createClient({ url: `file:${path.join(dir, "t.db")}` });
    const { rows } = await fresh.execute("SELECT id, name FROM accounts WHERE id = 'a1'");
    expect({ ...rows[0] }).toEqual({ id: "a1", name: "Township roads" });
    fresh.close();
  });

  it("maps through drizzle as before: selected fields, joins with repeated names, nulls", async () => {
    const db = drizzle(client);
    const joined = await db.select({ unit: units, account: accounts }).from(units).innerJoin(accounts, eq(accounts.id, units.accountId)).orderBy(units.id);
    expect(joined).toEqual([
      { unit: { id: "u1", number: "T-14", accountId: "a1" }, account: { id: "a1", name: "Township roads", limitCents: 250000 } },
      { unit: { id: "u2", number: "B-3", accountId: "a2" }, account: { id: "a2", name: "School buses", limitCents: null } },
    ]);
    expect(await db.select({ n: units.number }).from(units).where(eq(units.id, "nobody"))).toEqual([]);
  });
});
