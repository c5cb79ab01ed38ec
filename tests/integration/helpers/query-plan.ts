import type { InArgs, InStatement } from "@libsql/client";
import { getClient } from "@/db/client";

export interface Captured {
  sql: string;
  args: InArgs | undefined;
}

/**
 * Runs fn and returns every statement it sent through the shared client: the
 * SQL the query functions really run, parameters included, not a copy of it.
 */
export async function captureSql(fn: () => Promise<unknown>): Promise<Captured[]> {
  const client = getClient();
  const original = client.execute.bind(client);
  const seen: Captured[] = [];
  const spy = (stmt: InStatement | string, args?: InArgs) => {
    if (typeof stmt === "string") seen.push({ sql: stmt, args });
    else seen.push({ sql: stmt.sql, args: stmt.args });
    return typeof stmt === "string" ? original(stmt, args) : original(stmt);
  };
  (client as { execute: unknown }).execute = spy;
  try {
    await fn();
  } finally {
    (client as { execute: unknown }).execute = original;
  }
  return seen;
}

export interface PlanRow {
  id: number;
  parent: number;
  detail: string;
}

export async function queryPlan(stmt: Captured): Promise<PlanRow[]> {
  const res = await getClient().execute({ sql: `EXPLAIN QUERY PLAN ${stmt.sql}`, args: stmt.args ?? [] });
  return res.rows.map((r) => ({ id: Number(r.id), parent: Number(r.parent), detail: String(r.detail) }));
}

/**
 * What in a plan grows with history: a full scan of a table (no index at all),
 * a sort of the whole result in a temporary B-tree for ORDER BY, or, in a
 * statement with no LIMIT, a walk of a whole index (`SCAN t USING [COVERING]
 * INDEX i`: a count over every row the index holds). A walk of an index in
 * order stops at the LIMIT when there is one, and a sort of only the last
 * ORDER BY term (`RIGHT PART`/`LAST TERM`) sorts ties within one indexed key;
 * neither is reported. `sql` is the statement, to know whether it has a LIMIT.
 */
export function growthIn(plan: PlanRow[], smallTables: ReadonlySet<string>, sql = ""): string[] {
  const problems: string[] = [];
  const limited = /\blimit\b/i.test(sql);
  // A subquery's own rows (a co-routine or materialised result) are what its plan above them reads: not a table.
  const subqueries = new Set(plan.map((r) => /^(?:CO-ROUTINE|MATERIALIZE) (\w+)/.exec(r.detail)?.[1]).filter(Boolean));
  for (const row of plan) {
    const scan = /^SCAN (\w+)(?: AS \w+)?$/.exec(row.detail);
    if (scan && !smallTables.has(scan[1]!) && !subqueries.has(scan[1]!)) problems.push(row.detail);
    const indexWalk = /^SCAN (\w+)(?: AS \w+)? USING (?:COVERING )?INDEX \w+$/.exec(row.detail);
    if (indexWalk && !limited && !smallTables.has(indexWalk[1]!)) problems.push(`${row.detail} (the whole index, no LIMIT)`);
    if (row.detail === "USE TEMP B-TREE FOR ORDER BY") {
      // The table the sort is over: the outer loop at the same level (a join's order is its outer table's).
      const source = plan.find((r) => r.parent === row.parent && r.id < row.id && /^(?:SCAN|SEARCH) /.test(r.detail))?.detail ?? "?";
      const table = /^(?:SCAN|SEARCH) (\w+)/.exec(source)?.[1];
      if (!table || !smallTables.has(table)) problems.push(`${row.detail} (over ${source})`);
    }
  }
  return problems;
}
