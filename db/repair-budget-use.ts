import { openDatabase } from "./client";
import { rebuildBudgetUse } from "./queries/budget-use";

/**
 * Counts every account's repair-budget use again from its lines (the running totals of
 * account_budget_use), in one write transaction. Only needed if rows were written outside
 * the app, e.g. lines edited by hand in SQL; the app keeps the totals itself.
 */
const url = process.env.DATABASE_URL ?? "file:./data/cotter.db";
const { client, db } = openDatabase(url, process.env.DATABASE_AUTH_TOKEN);
db.transaction((tx) => rebuildBudgetUse(tx), { behavior: "immediate" })
  .then((n) => console.log(`Counted the budget use of ${n} account${n === 1 ? "" : "s"} in ${url} again.`))
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(() => client.close());
