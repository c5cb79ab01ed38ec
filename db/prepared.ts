import type { Transaction } from "@libsql/client";
import type { Reader } from "./client";

/** What drizzle keeps on a database or transaction object: the libSQL client, and the transaction when inside one. */
interface Session {
  client: object;
  tx?: Transaction;
}

function sessionOf(reader: Reader): Session {
  return (reader as unknown as { session: Session }).session;
}

/**
 * A hot query whose SQL is built once per database client, for any reader.
 *
 * Drizzle turns a query builder into SQL text on every call; on the
 * work-order view that was about 40 % of its time in process. `build` makes
 * the query with `sql.placeholder(...)` for its inputs and calls
 * `.prepare()`; the result is kept per client, and each call runs it on the
 * reader's own connection: inside the reader's transaction when it is one
 * (so a check and its write still see the same rows), on the client's pool
 * otherwise. Drizzle's libSQL prepared query reads its `tx` field on every
 * run, so an object over the kept one with that field set is all a call
 * needs (pinned drizzle-orm; tests/integration/prepared-queries.test.ts
 * checks a prepared read sees its transaction's uncommitted rows).
 */
export function prepared<Q extends object>(build: (reader: Reader) => Q): (reader: Reader) => Q {
  const byClient = new WeakMap<object, Q>();
  return (reader) => {
    const session = sessionOf(reader);
    let query = byClient.get(session.client);
    if (!query) {
      query = build(reader);
      byClient.set(session.client, query);
    }
    return Object.create(query, { tx: { value: session.tx } }) as Q;
  };
}
