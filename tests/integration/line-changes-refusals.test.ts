// Decisions and the standing authorisation apply line changes through one step
// (db/queries/line-changes.ts), so a refusal reads the same on both paths: the
// problem document with `lineId` and `amounts` (what is used, what the line adds,
// where that would land, the limit), and nothing written.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as decideOne } from "@/app/api/v1/lines/[id]/decision/route";
import { getDb } from "@/db/client";
import { recountBudgetUsed } from "@/db/queries/budget-use";
import { currentFiscalYear } from "@/db/queries/estimate-context";
import { addLine } from "@/db/queries/estimate-lines";
import { startUnderStanding } from "@/db/queries/estimate-send";
import { accounts } from "@/db/schema";
import { HttpError, problemBody } from "@/lib/http/problem";
import { call, sessionUser, type Problem } from "./helpers/app";
import { lineByDescription, linesOf, workOrderByNumber } from "./helpers/work-orders";

type Refusal = Problem & { lineId: string; amounts: { newCents: number; usedCents: number; afterCents: number; limitCents: number } };
const KEYS = ["amounts", "code", "detail", "lineId", "status", "title", "type"];

async function standingRefusal(workOrderId: string, lineId: string): Promise<Refusal> {
  const error: unknown = await startUnderStanding(await sessionUser("writer@quarry-road.example"), workOrderId, [lineId]).then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(HttpError);
  return problemBody(error as HttpError) as unknown as Refusal;
}

describe("one 409 body for decisions and the standing authorisation", () => {
  it("names the line and the amounts the same way for a limit of the approver and of the standing authorisation", async () => {
    // Decision: the supervisor's $5,000.00 signing limit on W-1042 (demo data), the $5,640.00 moldboard.
    const w1042 = await workOrderByNumber(1042);
    const moldboard = await lineByDescription(w1042.id, "Moldboard");
    const decided = await call<Refusal>(decideOne, {
      path: `/api/v1/lines/${moldboard.id}/decision`,
      params: { id: moldboard.id },
      as: "supervisor@brennan-twp.example",
      body: { decision: "approve", expectedVersion: moldboard.version },
    });
    expect(decided.status).toBe(409);
    expect(decided.body.code).toBe("signing_limit_exceeded");
    expect(Object.keys(decided.body).sort()).toEqual(KEYS);
    expect(decided.body).toMatchObject({ lineId: moldboard.id, amounts: { newCents: 564_000, limitCents: 500_000 } });
    expect(decided.body.amounts.afterCents).toBe(decided.body.amounts.usedCents + 564_000);

    // Standing: Bus 9's visit W-1047 (Alder Falls schools, $200.00 standing authorisation), a $232.50 line.
    const w1047 = await workOrderByNumber(1047);
    const line = await addLine(await sessionUser("writer@quarry-road.example"), {
      workOrderId: w1047.id, kind: "labor", description: "Trace the heater circuit", partNumber: "", quantity: 1500, unitPrice: 15_500, taxable: false, coreCharge: 0, isDiagnosis: false,
    });
    const before = await linesOf(w1047.id);
    const standing = await standingRefusal(w1047.id, line.id);
    expect(standing.code).toBe("standing_authorisation_exceeded");
    expect(Object.keys(standing).sort()).toEqual(KEYS);
    expect(standing).toMatchObject({ lineId: line.id, amounts: { newCents: 23_250, limitCents: 20_000 } });
    expect(standing.amounts.afterCents).toBe(standing.amounts.usedCents + 23_250);
    expect(await linesOf(w1047.id)).toEqual(before);
  });

  it("refuses past the repair budget on both paths with the same amounts", async () => {
    const w1047 = await workOrderByNumber(1047);
    const [account] = await getDb().select().from(accounts).where(eq(accounts.id, w1047.accountId));
    const used = await recountBudgetUsed(getDb(), account!.id, currentFiscalYear(account!));
    // $1.00 of budget left: any line is too much.
    await getDb().update(accounts).set({ repairBudgetCents: used + 100 }).where(eq(accounts.id, account!.id));
    const line = await addLine(await sessionUser("writer@quarry-road.example"), {
      workOrderId: w1047.id, kind: "part", description: "Blower resistor", partNumber: "", quantity: 1000, unitPrice: 4_000, taxable: true, coreCharge: 0, isDiagnosis: false,
    });
    const standing = await standingRefusal(w1047.id, line.id);
    expect(standing.code).toBe("budget_exceeded");
    expect(standing).toMatchObject({ lineId: line.id, amounts: { usedCents: used, newCents: 4_000, afterCents: used + 4_000, limitCents: used + 100 } });

    const w1044 = await workOrderByNumber(1044);
    const slack = await lineByDescription(w1044.id, "slack adjuster, adjust");
    const decided = await call<Refusal>(decideOne, {
      path: `/api/v1/lines/${slack.id}/decision`,
      params: { id: slack.id },
      as: "transport@alder-falls-schools.example",
      body: { decision: "approve", expectedVersion: slack.version },
    });
    expect(decided.status).toBe(409);
    expect(decided.body.code).toBe("budget_exceeded");
    expect(Object.keys(decided.body).sort()).toEqual(Object.keys(standing).sort());
    expect(decided.body).toMatchObject({ lineId: slack.id, amounts: { usedCents: used, limitCents: used + 100 } });
    expect(decided.body.amounts.afterCents).toBe(used + decided.body.amounts.newCents);
  });
});
