import { createClient, type Client, type ResultSet } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import type { BaseSQLiteDatabase } from "drizzle-orm/sqlite-core";
import * as schema from "./schema";
import { installStatementCache } from "./statement-cache";
import { env } from "@/lib/env";

export type Db = LibSQLDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either the database or an open transaction: for reads that run both inside and outside a write. */
export type Reader = BaseSQLiteDatabase<"async", ResultSet, typeof schema>;

interface PendingWrite {
  fn: (tx: Tx) => Promise<unknown>;
  resolve: (value: unknown) => void;
  reject: (error: unknown) => void;
}

interface Handle {
  url: string;
  client: Client;
  db: Db;
  pending: PendingWrite[];
  draining: boolean;
}

// One handle per process (kept on globalThis so dev-server reloads reuse it).
const holder = globalThis as unknown as { __cotterDb?: Handle };

export function isFileUrl(url: string): boolean {
  return url.startsWith("file:");
}

export function openDatabase(url: string, authToken?: string): Handle {
  if (isFileUrl(url)) installStatementCache();
  const client = createClient({
    url,
    authToken,
    // Busy timeout for a local file. Writers in this process are queued below,
    // so this only covers another process (a seed or migrate script) holding the lock.
    timeout: 3_000,
  });
  return { url, client, db: drizzle(client, { schema }), pending: [], draining: false };
}

function handle(): Handle {
  const { DATABASE_URL, DATABASE_AUTH_TOKEN } = env();
  if (!holder.__cotterDb || holder.__cotterDb.url !== DATABASE_URL) {
    holder.__cotterDb?.client.close();
    holder.__cotterDb = openDatabase(DATABASE_URL, DATABASE_AUTH_TOKEN);
  }
  return holder.__cotterDb;
}

export function getDb(): Db {
  return handle().db;
}

export function getClient(): Client {
  return handle().client;
}

/**
 * Runs fn inside one write transaction (BEGIN IMMEDIATE). The local SQLite
 * driver is synchronous, so two writers in one process waiting on each other's
 * lock would block the event loop; queueing them here avoids that, and a
 * networked libSQL server serialises writers across instances itself.
 *
 * Writes asked for in the same turn of the event loop (the requests whose
 * bytes arrived together), and those that queue up while one runs, are
 * committed together (group commit):
 * one transaction, each write in its own savepoint, in the order they came, and
 * each promise settles only after that one COMMIT, so a caller is never told of
 * a change that is not on disk. A write that throws an HttpError (a refusal)
 * undoes its own savepoint only; any other error rolls the whole group back,
 * fails that write and runs the others again in the next group, none of them
 * having committed. The COMMIT's fsync, most of a small write's cost, is then
 * paid once per group instead of once per write.
 */
export function writeTx<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
  const h = handle();
  return new Promise<T>((resolve, reject) => {
    h.pending.push({ fn, resolve: resolve as (value: unknown) => void, reject });
    if (h.draining) return;
    h.draining = true;
    // The driver is synchronous, so a write started at once would run to its COMMIT before the
    // requests that arrived with it got as far as asking to write: each would pay its own fsync.
    // Started after this turn's I/O callbacks instead, the writes they ask for join its group.
    setImmediate(() => void drainWrites(h));
  });
}

/** At most this many writes share one COMMIT, so one group never holds the lock for long. */
const GROUP_MAX = 32;

class GroupAborted extends Error {
  constructor(readonly failed: number, readonly error: unknown) {
    super("write group rolled back");
  }
}

/** lib/http/problem.ts's HttpError (a 4xx or 5xx the write chose to answer with), known by name so the client needs nothing of the http layer. */
function isRefusal(error: unknown): boolean {
  return error instanceof Error && error.name === "HttpError";
}

/** Runs the queued writes group by group; writeTx set `draining` when it scheduled this. */
async function drainWrites(h: Handle): Promise<void> {
  try {
    while (h.pending.length > 0) {
      const group = h.pending.splice(0, GROUP_MAX);
      if (group.length === 1) {
        const [only] = group as [PendingWrite];
        await h.db.transaction(only.fn).then(only.resolve, only.reject);
        continue;
      }
      const outcomes: { ok: boolean; value: unknown }[] = [];
      try {
        await h.db.transaction(async (tx) => {
          for (const [i, write] of group.entries()) {
            try {
              outcomes.push({ ok: true, value: await tx.transaction((savepoint) => write.fn(savepoint)) });
            } catch (error) {
              if (!isRefusal(error)) throw new GroupAborted(i, error);
              outcomes.push({ ok: false, value: error });
            }
          }
        });
      } catch (error) {
        if (error instanceof GroupAborted) {
          group[error.failed]!.reject(error.error);
          // Nothing of the group was kept: the others run again, first in the queue, in their order.
          h.pending.unshift(...group.filter((_, i) => i !== error.failed));
        } else {
          for (const write of group) write.reject(error);
        }
        continue;
      }
      group.forEach((write, i) => (outcomes[i]!.ok ? write.resolve(outcomes[i]!.value) : write.reject(outcomes[i]!.value)));
    }
  } finally {
    h.draining = false;
  }
}

/** More work for a write's own transaction, given its result: callers queue the e-mail about the change here. */
export type InSameTx<R> = (tx: Tx, result: R) => Promise<void>;

/** writeTx, then `also` inside the same transaction with the result, so both commit or neither does. */
export function writeTxThen<T>(fn: (tx: Tx) => Promise<T>, also?: InSameTx<T>): Promise<T> {
  return writeTx(async (tx) => {
    const result = await fn(tx);
    if (also) await also(tx, result);
    return result;
  });
}

export function closeDb(): void {
  holder.__cotterDb?.client.close();
  holder.__cotterDb = undefined;
}
