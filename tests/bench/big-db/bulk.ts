import type { Client, Transaction } from "@libsql/client";
import { getTableColumns, getTableName } from "drizzle-orm";
import type { SQLiteTable } from "drizzle-orm/sqlite-core";

const ROWS_PER_STATEMENT = 2_000;

/**
 * Multi-row INSERTs from rows typed by db/schema.ts, buffered per table and
 * written in one open write transaction (committed every `commitEvery`
 * rows). Each statement takes its rows as one JSON array that SQLite unpacks
 * with json_each: binding millions of values one at a time through the
 * driver costs more than the load itself. Values go through each column's
 * own driver mapping, so booleans and JSON are stored as the app stores them.
 */
export class BulkWriter {
  private tx: Transaction | null = null;
  private readonly buffers = new Map<SQLiteTable, { columns: string[]; rows: Record<string, unknown>[] }>();
  private sinceCommit = 0;

  constructor(
    private readonly client: Client,
    private readonly commitEvery = 400_000,
  ) {}

  async add<T extends SQLiteTable>(table: T, row: T["$inferInsert"]): Promise<void> {
    let buffer = this.buffers.get(table);
    const record = row as Record<string, unknown>;
    if (!buffer) {
      buffer = { columns: Object.keys(record), rows: [] };
      this.buffers.set(table, buffer);
    }
    buffer.rows.push(record);
    if (buffer.rows.length >= ROWS_PER_STATEMENT) {
      await this.flushTable(table);
      if (this.sinceCommit >= this.commitEvery) await this.commit();
    }
  }

  private async flushTable(table: SQLiteTable): Promise<void> {
    const buffer = this.buffers.get(table);
    if (!buffer || buffer.rows.length === 0) return;
    const all = getTableColumns(table) as Record<string, { name: string; mapToDriverValue(v: unknown): unknown }>;
    const columns = buffer.columns.map((key) => {
      const column = all[key];
      if (!column) throw new Error(`${getTableName(table)} has no column ${key}`);
      return column;
    });
    const tuples: unknown[][] = [];
    for (const row of buffer.rows) {
      const keys = Object.keys(row);
      if (keys.length !== buffer.columns.length) throw new Error(`${getTableName(table)}: every row must set the same columns`);
      tuples.push(buffer.columns.map((key, i) => {
        const value = row[key];
        return value === null || value === undefined ? null : columns[i]!.mapToDriverValue(value);
      }));
    }
    const names = columns.map((c) => `"${c.name}"`).join(",");
    const picks = columns.map((_, i) => `value ->> ${i}`).join(",");
    const sql = `INSERT INTO "${getTableName(table)}" (${names}) SELECT ${picks} FROM json_each(?)`;
    const tx = await this.transaction();
    await tx.execute({ sql, args: [JSON.stringify(tuples)] });
    this.sinceCommit += buffer.rows.length;
    buffer.rows = [];
  }

  /** The open write transaction (opened on first use). */
  async transaction(): Promise<Transaction> {
    this.tx ??= await this.client.transaction("write");
    return this.tx;
  }

  async flush(): Promise<void> {
    for (const table of this.buffers.keys()) await this.flushTable(table);
  }

  /** Writes every buffered row and commits. */
  async commit(): Promise<void> {
    await this.flush();
    const tx = this.tx;
    this.tx = null;
    this.sinceCommit = 0;
    await tx?.commit();
  }
}
