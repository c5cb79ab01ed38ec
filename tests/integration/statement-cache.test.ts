// The prepared-statement cache under the libSQL client (db/statement-cache.ts):
// the same answers as preparing each time, through the client the app uses,
// including after a schema change, a failed statement and a rolled-back
// transaction; and a bounded size per connection.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import Database from "libsql";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { STATEMENTS_PER_CONNECTION, cachedStatements, installStatementCache } from "@/db/statement-cache";

let dir: string;
let client: Client;

beforeAll(async () => {
  installStatementCache();
  dir = mkdtempSync(path.join(tmpdir(), "cotter-statements-"));
  client = createClient({ url: `file:${path.join(dir, "t.db")}` });
  await client.execute("CREATE TABLE t (id INTEGER PRIMARY KEY, name TEXT NOT NULL UNIQUE)");
});

afterAll(() => {
  client.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("a connection's statements", () => {
  it("prepares a statement once and hands the same one back", () => {
    const db = new Database(path.join(dir, "t.db"));
    const sql = "SELECT name FROM t WHERE id = ?";
    expect(db.prepare(sql)).toBe(db.prepare(sql));
    expect(cachedStatements(db)).toBe(1);
    // Another connection has statements of its own.
    const other = new Database(path.join(dir, "t.db"));
    expect(other.prepare(sql)).not.toBe(db.prepare(sql));
    db.close();
    other.close();
  });

  it("keeps at most its bound, dropping the least recently used", () => {
    const db = new Database(":memory:");
    const first = db.prepare("SELECT 0");
    for (let i = 1; i <= STATEMENTS_PER_CONNECTION; i++) db.prepare(`SELECT ${i}`);
    expect(cachedStatements(db)).toBe(STATEMENTS_PER_CONNECTION);
    expect(db.prepare("SELECT 0")).not.toBe(first);
    // A hit moves to the back: "SELECT 2" stays while older ones go.
    const kept = db.prepare("SELECT 2");
    for (let i = 0; i < 5; i++) db.prepare(`SELECT 'x${i}'`);
    expect(db.prepare("SELECT 2")).toBe(kept);
    db.close();
  });
});

describe("through the libSQL client", () => {
  it("answers each call with its own arguments, writes included", async () => {
    for (const name of ["plow", "grader", "loader"]) {
      const r = await client.execute({ sql: "INSERT INTO t (name) VALUES (?)", args: [name] });
      expect(r.rowsAffected).toBe(1);
    }
    const names = async (min: number) => (await client.execute({ sql: "SELECT name FROM t WHERE id >= ? ORDER BY id", args: [min] })).rows.map((r) => r.name);
    expect(await names(1)).toEqual(["plow", "grader", "loader"]);
    expect(await names(3)).toEqual(["loader"]);
    expect(await names(2)).toEqual(["grader", "loader"]);
  });

  it("reads the new shape after a schema change", async () => {
    const star = "SELECT * FROM t ORDER BY id LIMIT 1";
    expect((await client.execute(star)).columns).toEqual(["id", "name"]);
    await client.execute("ALTER TABLE t ADD COLUMN note TEXT");
    const after = await client.execute(star);
    expect(after.columns).toEqual(["id", "name", "note"]);
    expect(after.rows[0]).toMatchObject({ name: "plow", note: null });
  });

  it("reuses a statement that failed, and a rolled-back transaction leaves nothing", async () => {
    const insert = { sql: "INSERT INTO t (name) VALUES (?)", args: ["plow"] };
    await expect(client.execute(insert)).rejects.toThrow(/UNIQUE/);
    expect((await client.execute({ ...insert, args: ["sweeper"] })).rowsAffected).toBe(1);

    const tx = await client.transaction("write");
    await tx.execute({ ...insert, args: ["mower"] });
    await tx.rollback();
    const tx2 = await client.transaction("write");
    await tx2.execute({ ...insert, args: ["roller"] });
    await tx2.commit();
    const all = (await client.execute("SELECT name FROM t ORDER BY id")).rows.map((r) => r.name);
    expect(all).toEqual(["plow", "grader", "loader", "sweeper", "roller"]);
  });
});
