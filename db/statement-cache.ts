import Database from "libsql";
import { clientRows } from "./client-rows";

type Statement = ReturnType<Database.Database["prepare"]>;

/** Statements kept per connection; the app runs a few hundred distinct ones, so this holds every hot one. */
export const STATEMENTS_PER_CONNECTION = 300;

interface Cache {
  generation: number;
  statements: Map<string, Statement>;
}

/**
 * Kept on globalThis: the patch is on the driver's one shared prototype, so a
 * second copy of this module (a test runner's set-up loads its own) must find
 * it installed and use the same caches, or every statement is wrapped twice.
 */
const shared = ((globalThis as Record<symbol, unknown>)[Symbol.for("cotter.statementCache")] ??= {
  installed: false,
  // Bumped by anything that may change the schema; every cache made before it is dropped on its next use.
  generation: 0,
  byConnection: new WeakMap<Database.Database, Cache>(),
}) as { installed: boolean; generation: number; byConnection: WeakMap<Database.Database, Cache> };
const byConnection = shared.byConnection;

/** Schema changes and transaction control are not worth keeping; anything else that is not plain DML may change the schema. */
function changesSchema(sql: string): boolean {
  return !/^\s*(select|insert|update|delete|with|replace|begin|commit|rollback|savepoint|release|pragma\s+\w+\s*$)/i.test(sql);
}

/**
 * Keeps each connection's prepared statements for reuse.
 *
 * The libSQL client (`@libsql/client`, file URLs) prepares every statement
 * afresh on each `execute` and asks the native side for its columns twice; a
 * CPU profile of the work-order view put that at about a fifth of the
 * request. The client offers no cache, so its one entry point is wrapped:
 * `Database.prototype.prepare` of the `libsql` package it is built on.
 *
 * Safe because the client uses a statement synchronously from prepare to its
 * last row (`all` or `run`), so two callers never hold one at once, and every
 * use sets the statement's modes (raw, safe integers) again. A statement that
 * may change the schema empties every cache, and the column list remembered
 * with a statement goes with it; SQLite re-prepares a stale statement itself.
 */
export function installStatementCache(): void {
  if (shared.installed) return;
  shared.installed = true;
  const prepare = Database.prototype.prepare;
  const exec = Database.prototype.exec;

  Database.prototype.exec = function (this: Database.Database, source: string) {
    shared.generation += 1;
    return exec.call(this, source);
  };

  Database.prototype.prepare = function (this: Database.Database, sql: string) {
    if (changesSchema(sql)) {
      shared.generation += 1;
      return prepare.call(this, sql);
    }
    let cache = byConnection.get(this);
    if (!cache || cache.generation !== shared.generation) {
      cache = { generation: shared.generation, statements: new Map() };
      byConnection.set(this, cache);
    }
    const hit = cache.statements.get(sql);
    if (hit) {
      // Map order is insertion order: moving a hit to the end makes the first key the least recently used.
      cache.statements.delete(sql);
      cache.statements.set(sql, hit);
      return hit;
    }
    const statement = remembered(prepare.call(this, sql));
    cache.statements.set(sql, statement);
    if (cache.statements.size > STATEMENTS_PER_CONNECTION) cache.statements.delete(cache.statements.keys().next().value!);
    return statement;
  } as Database.Database["prepare"];
}

/**
 * The column list and whether the statement returns rows do not change while
 * the schema does not: ask the native side once. Rows read in raw mode (the
 * client's way) leave as db/client-rows.ts builds them.
 */
function remembered(statement: Statement): Statement {
  let columns: ReturnType<Statement["columns"]> | undefined;
  let names: string[] | undefined;
  let notReader: unknown;
  let raw = false;
  const ownColumns = statement.columns.bind(statement);
  const ownRaw = statement.raw.bind(statement);
  const ownAll = statement.all.bind(statement) as (...params: unknown[]) => unknown[];
  statement.columns = () => (columns ??= ownColumns());
  statement.all = (...args: unknown[]) => {
    const rows = ownAll(...args);
    return raw ? clientRows(rows, (names ??= statement.columns().map((c) => c.name))) : rows;
  };
  statement.raw = (toggle?: boolean) => {
    if (notReader) throw notReader;
    try {
      const same = ownRaw(toggle);
      raw = toggle !== false;
      return same;
    } catch (error) {
      notReader = error;
      throw error;
    }
  };
  return statement;
}

/** How many statements a connection holds now (for the test of the cache itself). */
export function cachedStatements(connection: Database.Database): number {
  const cache = byConnection.get(connection);
  return cache && cache.generation === shared.generation ? cache.statements.size : 0;
}
