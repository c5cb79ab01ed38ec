import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { updateAccount } from "@/db/queries/account-writes";
import { decide } from "@/db/queries/decisions";
import { addLine, bringBackDeferred, editLine } from "@/db/queries/estimate-lines";
import { sendEstimate, startUnderStanding } from "@/db/queries/estimate-send";
import { accounts, auditLog, estimateLines, workOrders } from "@/db/schema";
import { getDb, writeTx } from "@/db/client";
import { deliverDueMail } from "@/lib/server/mail/worker";
import { DECISION_MAIL_WINDOW_MS, queueDecisionMade, queueEstimateReady, queueLineReopened } from "@/lib/server/notifications/estimate";
import { sessionUser } from "./helpers/app";
import { fileMailbox } from "./helpers/mail";
import { lineByDescription, linesOf, workOrderByNumber } from "./helpers/work-orders";

const mailbox = fileMailbox();

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

    await writeTx((tx) => queueLineReopened(tx, wo.id, { description: again.description, approvedCents: 18_640, revisedCents: 20_505, reason: back.reason ?? "" }));
    // One message per approver, so nobody sees the others' addresses.
    const mail = await mailbox.waitFor((m) => m.subject.includes("needs your approval again") && m.to.includes("supervisor@brennan-twp.example"));
    await mailbox.waitFor((m) => m.subject.includes("needs your approval again") && m.to.includes("trustee@brennan-twp.example"));
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
    await writeTx((tx) => queueEstimateReady(tx, wo.id, sentCount));
    const mail = await mailbox.waitFor((m) => m.subject.includes("Bus 9") && m.subject.includes("estimate ready"));
    expect(mail.to).toEqual(["transport@alder-falls-schools.example"]);
    expect(mail.text).toContain(`http://localhost:3000/fleet/work-orders/${wo.id}`);
  });

  it("tells the writer when the approver decides", async () => {
    const wo = await workOrderByNumber(1042);
    await writeTx((tx) => queueDecisionMade(tx, wo.id, { approverName: "Gary Holm", summary: "approve 1 line ($186.40)", stillPending: 9 }));
    // Decisions wait two minutes for others to join them; the worker is asked as if that time has come.
    await deliverDueMail(new Date(Date.now() + DECISION_MAIL_WINDOW_MS + 1000));
    const mail = await mailbox.waitFor((m) => m.subject.includes("Gary Holm decided"));
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

describe("account settings", () => {
  it("records every change in the audit log with before and after", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const [account] = await getDb().select().from(accounts).where(eq(accounts.name, "Kettle Ridge Stone Co."));
    const result = await updateAccount(owner, account!.id, {
      fields: {
        standingAuthorisationCents: 75_000, repairBudgetCents: 12_000_000, fiscalYearStartMonth: 1,
        overrunPercentMilli: 10_000, overrunCapCents: 1_000, overrunFloorCents: 1_000, taxExempt: false, taxExemptCertificate: null, taxRateMilliPct: 6_250,
        poRequired: true, paymentTermsDays: 30, shopSuppliesExempt: false,
      },
    });
    expect(result.changed).toBe(4);
    const [entry] = await getDb().select().from(auditLog).where(eq(auditLog.entityId, account!.id));
    expect(entry!.detail).toMatchObject({ standingAuthorisationCents: { from: 50_000, to: 75_000 }, repairBudgetCents: { from: null, to: 12_000_000 }, poRequired: { from: false, to: true } });
  });
});
