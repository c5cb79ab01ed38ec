import type { InStatement, Transaction } from "@libsql/client";
import { getClient } from "@/db/client";

export interface StatementLog {
  /** Every statement sent to the database, in order (SQL text only). */
  statements: string[];
}

function sqlOf(stmt: InStatement): string {
  return typeof stmt === "string" ? stmt : stmt.sql;
}

/**
 * Counts what `fn` sends through the client getDb() uses: each execute, each
 * statement of a batch, and the statements run inside a transaction (BEGIN and
 * COMMIT are the driver's own and not counted). Restores the client afterwards.
 */
export async function countStatements<T>(fn: () => Promise<T>): Promise<{ result: T; log: StatementLog }> {
  const client = getClient();
  const log: StatementLog = { statements: [] };
  const seen = (stmt: InStatement) => {
    log.statements.push(sqlOf(stmt));
  };
  const original = { execute: client.execute, batch: client.batch, transaction: client.transaction };
  const wrapTx = (tx: Transaction): Transaction => {
    const execute = tx.execute.bind(tx);
    const batch = tx.batch.bind(tx);
    tx.execute = ((stmt: InStatement) => {
      seen(stmt);
      return execute(stmt);
    }) as Transaction["execute"];
    tx.batch = ((stmts: InStatement[]) => {
      stmts.forEach(seen);
      return batch(stmts);
    }) as Transaction["batch"];
    return tx;
  };
  const execute = original.execute as (this: typeof client, ...args: unknown[]) => ReturnType<typeof client.execute>;
  client.execute = ((stmt: InStatement, ...rest: unknown[]) => {
    seen(stmt);
    return execute.call(client, stmt, ...rest);
  }) as typeof client.execute;
  client.batch = ((stmts: InStatement[], mode?: Parameters<typeof client.batch>[1]) => {
    stmts.forEach(seen);
    return original.batch.call(client, stmts, mode);
  }) as typeof client.batch;
  const transaction = original.transaction as (this: typeof client, ...args: unknown[]) => Promise<Transaction>;
  client.transaction = (async (...args: unknown[]) => wrapTx(await transaction.call(client, ...args))) as typeof client.transaction;
  try {
    const result = await fn();
    return { result, log };
  } finally {
    Object.assign(client, original);
  }
}
