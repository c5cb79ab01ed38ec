import { createClient, type Client, type ResultSet } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import type { BaseSQLiteDatabase } from "drizzle-orm/sqlite-core";
import * as schema from "./schema";
import { env } from "@/lib/env";

export type Db = LibSQLDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either the database or an open transaction: for reads that run both inside and outside a write. */
export type Reader = BaseSQLiteDatabase<"async", ResultSet, typeof schema>;

interface Handle {
  url: string;
  client: Client;
  db: Db;
  queue: Promise<unknown>;
}

// One handle per process (kept on globalThis so dev-server reloads reuse it).
const holder = globalThis as unknown as { __cotterDb?: Handle };

export function isFileUrl(url: string): boolean {
  return url.startsWith("file:");
}

export function openDatabase(url: string, authToken?: string): Handle {
  const client = createClient({
    url,
    authToken,
    // Busy timeout for a local file. Writers in this process are queued below,
    // so this only covers another process (a seed or migrate script) holding the lock.
    timeout: 3_000,
  });
  return { url, client, db: drizzle(client, { schema }), queue: Promise.resolve() };
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
 */
export function writeTx<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
  const h = handle();
  const run = h.queue.then(() => h.db.transaction(fn));
  h.queue = run.catch(() => undefined);
  return run;
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
