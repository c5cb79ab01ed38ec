// What one approval over the API costs (issue 12): every SQL statement
// `POST /api/v1/lines/:id/decision` sends through the client getDb() uses, from
// the session check to the answer, and the repo's own files the route loads.
//
// Before issue 12 (3 December 2026): 18 statements (the work order read three times, the line
// three times, the account's whole approval history summed for the budget) from 9 files that
// issue SQL, and a route that loads 54 of the repo's files at run time.
// After: 13 statements (session; work order with account, unit and shop settings; lines; the
// budget's running total; line; decision; total; timeline; work order; audit; writers; the grouped
// mail's lookup and row) from 8 files that issue SQL; the route loads 58 files (the shared step,
// the running total, the line mapper and the decisions' wording are files of their own now),
// 59 once the photo addresses moved out of the upload glue into lib/uploads/photo-urls.ts, 60
// with the formatters built once per process (lib/intl-cache.ts), 61 with the invoice's one shape
// (lib/records/invoice.ts, which the mail worker's invoice attachments load), 62 with the route
// inputs shared with the OpenAPI description (lib/validation/api-queries.ts, where idParams lives),
// 64 with the prepared-statement cache under the client (db/statement-cache.ts) and the hot
// queries built once (db/prepared.ts), 65 with the client's rows built once per column list
// (db/client-rows.ts).
// The bounds below are today's figures, so neither can silently grow back.
import { beforeAll, describe, expect, it } from "vitest";
import { POST as decideOne } from "@/app/api/v1/lines/[id]/decision/route";
import { startMailWorker, stopMailWorker } from "@/lib/server/mail/worker";
import { runtimeImportGraph } from "../support/import-graph";
import { call, sessionCookie } from "./helpers/app";
import { countStatements } from "./helpers/count-statements";
import { lineByDescription, workOrderByNumber } from "./helpers/work-orders";

const SUPERVISOR = "supervisor@brennan-twp.example";
const ROUTE = "app/api/v1/lines/[id]/decision/route.ts";
const STATEMENTS_NOW = 13;
const FILES_LOADED_NOW = 65;

beforeAll(async () => {
  // The mail worker's own reads after the commit are not the approval's.
  startMailWorker();
  await stopMailWorker();
});

describe("one approval over the API", () => {
  it(`sends at most ${STATEMENTS_NOW} SQL statements`, async () => {
    const wo = await workOrderByNumber(1042);
    const seal = await lineByDescription(wo.id, "seal kit");
    const cookie = await sessionCookie(SUPERVISOR);
    const { result, log } = await countStatements(() =>
      call<{ line: { state: string } }>(decideOne, {
        path: `/api/v1/lines/${seal.id}/decision`,
        params: { id: seal.id },
        headers: { cookie },
        body: { decision: "approve", expectedVersion: seal.version },
      }),
    );
    expect(result.status).toBe(200);
    expect(result.body.line.state).toBe("approved");
    // Printed so a change is easy to read off the test output.
    console.info(`one approval: ${log.statements.length} statements\n${log.statements.map((s) => `  ${s.slice(0, 120)}`).join("\n")}`);
    expect(log.statements.length).toBeLessThanOrEqual(STATEMENTS_NOW);
  });

  it(`loads at most ${FILES_LOADED_NOW} of the repo's files`, () => {
    const files = runtimeImportGraph(ROUTE);
    expect(files).toContain(ROUTE);
    expect(files.length).toBeLessThanOrEqual(FILES_LOADED_NOW);
  });
});
