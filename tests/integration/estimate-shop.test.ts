import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { updateAccount } from "@/db/queries/account-writes";
import { decide } from "@/db/queries/decisions";
import { addLine, bringBackDeferred, editLine } from "@/db/queries/estimate-lines";
import { sendEstimate, startUnderStanding } from "@/db/queries/estimate-send";
import { clockIn, clockOut } from "@/db/queries/time-clock";
import { accounts, auditLog, estimateLines, timeEntries, workOrders } from "@/db/schema";
import { getDb } from "@/db/client";
import { resetEnvCache } from "@/lib/env";
import { notifyDecisionMade, notifyEstimateReady, notifyLineReopened } from "@/lib/notifications/estimate";
import { startFakeSmtp, type FakeSmtp } from "@/mocks/smtp/server";
import { sessionUser } from "./helpers/app";
import { lineByDescription, linesOf, workOrderByNumber } from "./helpers/work-orders";

let smtp: FakeSmtp;
beforeAll(async () => {
  smtp = await startFakeSmtp();
  process.env.SMTP_URL = `smtp://127.0.0.1:${smtp.smtpPort}`;
  resetEnvCache();
});
afterAll(async () => {
  await smtp.close();
});

const writer = () => sessionUser("writer@quarry-road.example");
const supervisor = () => sessionUser("supervisor@brennan-twp.example");

describe("the writer's estimate: revise, start under standing authorisation, bring deferred work back", () => {
  it("keeps an approval when a revision stays inside the overrun allowance (10 %, at most $50)", async () => {
    const wo = await workOrderByNumber(1042);
    const seal = await lineByDescription(wo.id, "seal kit");
    const { result } = await decide(await supervisor(), wo.id, [{ lineId: seal.id, decision: "approve", expectedVersion: seal.version }]);
    expect(result.changes[0]!.state).toBe("approved");
    const approved = await lineByDescription(wo.id, "seal kit");
    // $186.40 approved; allowance min(10 % = $18.64, $50) → up to $205.04 holds.
    const held = await editLine(await writer(), {
      lineId: approved.id, expectedVersion: approved.version, kind: "part", description: approved.description, partNumber: "",
      quantity: 1000, unitPrice: 20_504, taxable: true, coreCharge: 0, concernId: approved.concernId ?? undefined, isDiagnosis: false,
    });
    expect(held.outcome).toBe("approval_holds");
    expect(held.line.state).toBe("approved");

    // One cent more than the allowance from the approved amount sends it back.
    const again = await lineByDescription(wo.id, "seal kit");
    const back = await editLine(await writer(), {
      lineId: again.id, expectedVersion: again.version, kind: "part", description: again.description, partNumber: "",
      quantity: 1000, unitPrice: 20_505, taxable: true, coreCharge: 0, concernId: again.concernId ?? undefined, isDiagnosis: false,
    });
    expect(back.outcome).toBe("back_to_proposed");
    expect(back.line).toMatchObject({ state: "proposed", approvedByUserId: null, approvedAmountCents: null, approvedAt: null });
    expect(back.reason).toMatch(/\$18\.64/);

    await notifyLineReopened(wo.id, { description: again.description, approvedCents: 18_640, revisedCents: 20_505, reason: back.reason ?? "" });
    // One message per approver, so nobody sees the others' addresses.
    const mail = await smtp.waitFor((m) => m.subject.includes("needs your approval again") && m.to.includes("supervisor@brennan-twp.example"));
    await smtp.waitFor((m) => m.subject.includes("needs your approval again") && m.to.includes("trustee@brennan-twp.example"));
    expect(mail.to).toEqual(["supervisor@brennan-twp.example"]);
    expect(mail.text).toContain(`/fleet/work-orders/${wo.id}`);
    expect(mail.text).toContain("$186.40");
  });

  it("starts a line under the standing authorisation, recorded as such, and refuses past it", async () => {
    const wo = await workOrderByNumber(1047); // Bus 9, Alder Falls: standing authorisation $200.00
    const w = await writer();
    const diag = await addLine(w, { workOrderId: wo.id, kind: "labor", description: "Diagnose heater blower", partNumber: "", quantity: 1000, unitPrice: 15_500, taxable: false, coreCharge: 0, isDiagnosis: true });
    expect(await startUnderStanding(w, wo.id, [diag.id])).toBe(1);
    const [row] = await getDb().select().from(estimateLines).where(eq(estimateLines.id, diag.id));
    expect(row).toMatchObject({ state: "approved", byStanding: true, approvedByUserId: null, approvedAmountCents: 15_500 });
    const more = await addLine(w, { workOrderId: wo.id, kind: "labor", description: "Smoke test exhaust", partNumber: "", quantity: 500, unitPrice: 15_500, taxable: false, coreCharge: 0, isDiagnosis: false });
    // $155.00 used + $77.50 = $232.50 > $200.00
    await expect(startUnderStanding(w, wo.id, [more.id])).rejects.toMatchObject({ status: 409, code: "standing_authorisation_exceeded" });
  });

  it("sends drafts to the fleet, moves the work order to Waiting on approval and e-mails the approvers a link", async () => {
    const wo = await workOrderByNumber(1047);
    const { sentCount } = await sendEstimate(await writer(), wo.id);
    expect(sentCount).toBe(1);
    const [after] = await getDb().select().from(workOrders).where(eq(workOrders.id, wo.id));
    expect(after!.status).toBe("waiting_approval");
    expect((await linesOf(wo.id)).filter((l) => l.state === "proposed")).toHaveLength(1);
    await notifyEstimateReady(wo.id, sentCount, 7_750, false);
    const mail = await smtp.waitFor((m) => m.subject.includes("Bus 9") && m.subject.includes("estimate ready"));
    expect(mail.to).toEqual(["transport@alder-falls-schools.example"]);
    expect(mail.text).toContain(`http://localhost:3000/fleet/work-orders/${wo.id}`);
  });

  it("tells the writer when the approver decides", async () => {
    const wo = await workOrderByNumber(1042);
    await notifyDecisionMade(wo.id, "Gary Holm", "approve 1 line ($186.40)", 9);
    const mail = await smtp.waitFor((m) => m.subject.includes("Gary Holm decided"));
    expect(mail.to).toEqual(["writer@quarry-road.example"]);
    expect(mail.text).toContain(`/work-orders/${wo.id}`);
  });

  it("brings held and declined lines of an earlier visit back as drafts, once", async () => {
    const wo = await workOrderByNumber(1042);
    const [earlier] = await getDb().select().from(workOrders).where(eq(workOrders.number, 1001));
    const deferred = (await linesOf(earlier!.id)).filter((l) => l.state === "held" || l.state === "declined");
    expect(deferred).toHaveLength(2);
    expect(await bringBackDeferred(await writer(), wo.id, deferred.map((l) => l.id))).toBe(2);
    const copies = (await linesOf(wo.id)).filter((l) => l.deferredFromLineId);
    expect(copies.map((c) => c.state)).toEqual(["draft", "draft"]);
    await expect(bringBackDeferred(await writer(), wo.id, [deferred[0]!.id])).rejects.toMatchObject({ status: 404 });
  });
});

describe("the diagnosis time box (warn at 80 %, stop at 100 %)", () => {
  it("refuses clocking in once the approved diagnosis hours are used, until an extension is approved", async () => {
    const wo = await workOrderByNumber(1043); // 2.0 h approved, 1.7 h used in the demo
    const diag = await lineByDescription(wo.id, "Diagnose no-start");
    const tech = await sessionUser("tech@quarry-road.example");
    // Use the rest of the box: backdate a running entry by 20 minutes, then clock out.
    const entry = await clockIn(tech, diag.id);
    await getDb().update(timeEntries).set({ startedAt: new Date(Date.now() - 20 * 60_000).toISOString() }).where(eq(timeEntries.id, entry.id));
    const out = await clockOut(tech, diag.id);
    expect(out.capped).toBe(true); // 1.7 h + 0.33 h would pass 2.0 h: cut off where the box filled
    expect(out.box).toMatchObject({ status: "blocked", approvedMilli: 2000 });
    expect(out.reachedNow).toBe(true);
    await expect(clockIn(tech, diag.id)).rejects.toMatchObject({ status: 409, code: "time_box_reached" });

    // The writer asks for 1.0 h more; the extension goes back to the approver, who approves it.
    const w = await writer();
    const current = await lineByDescription(wo.id, "Diagnose no-start");
    const revised = await editLine(w, {
      lineId: current.id, expectedVersion: current.version, kind: "labor", description: current.description, partNumber: "",
      quantity: 3000, unitPrice: current.unitPriceCents, taxable: false, coreCharge: 0, concernId: current.concernId ?? undefined, isDiagnosis: true,
    });
    expect(revised.outcome).toBe("back_to_proposed");
    await decide(await supervisor(), wo.id, [{ lineId: current.id, decision: "approve", expectedVersion: revised.line.version }]);
    await expect(clockIn(tech, current.id)).resolves.toMatchObject({ lineId: current.id });
  });
});

describe("account settings", () => {
  it("records every change in the audit log with before and after", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const [account] = await getDb().select().from(accounts).where(eq(accounts.name, "Kettle Ridge Stone Co."));
    const result = await updateAccount(owner, account!.id, {
      fields: {
        standingAuthorisationCents: 75_000, repairBudgetCents: 12_000_000, fiscalYearStartMonth: 1,
        overrunPercentMilli: 10_000, overrunCapCents: 1_000, overrunFloorCents: 0, taxExempt: false, taxExemptCertificate: null, taxRateMilliPct: 6_250,
        poRequired: true, paymentTermsDays: 30, shopSuppliesExempt: false,
      },
    });
    expect(result.changed).toBe(4);
    const [entry] = await getDb().select().from(auditLog).where(eq(auditLog.entityId, account!.id));
    expect(entry!.detail).toMatchObject({ standingAuthorisationCents: { from: 50_000, to: 75_000 }, repairBudgetCents: { from: null, to: 12_000_000 }, poRequired: { from: false, to: true } });
  });
});
