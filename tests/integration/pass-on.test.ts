// "Pass the rest to an approver who can" (product.md, "Authorised limits": above one approver's
// signing limit a second approver with a higher limit is needed). Nothing is decided by passing
// lines on; the limits on the server stay exactly as strict.
import { describe, expect, it } from "vitest";
import { decide } from "@/db/queries/decisions";
import { higherLimitApprovers, passLinesOn } from "@/db/queries/pass-on";
import { deliverDueMail } from "@/lib/server/mail/worker";
import { queuePassedOn } from "@/lib/server/notifications/pass-on";
import { sessionUser } from "./helpers/app";
import { fileMailbox } from "./helpers/mail";
import { lineByDescription, linesOf, workOrderByNumber } from "./helpers/work-orders";

const mailbox = fileMailbox();

describe("passing lines past one's signing limit to a colleague", () => {
  it("offers only active approvers of the same account with a higher limit", async () => {
    expect((await higherLimitApprovers(await sessionUser("supervisor@brennan-twp.example"))).map((c) => c.name)).toEqual(["Helen Vasquez"]);
    expect(await higherLimitApprovers(await sessionUser("trustee@brennan-twp.example"))).toEqual([]);
    expect(await higherLimitApprovers(await sessionUser("clerk@brennan-twp.example"))).toEqual([]);
  });

  it("records who passed what to whom, decides nothing, and e-mails the colleague a link to each line", async () => {
    const wo = await workOrderByNumber(1042);
    const moldboard = await lineByDescription(wo.id, "Moldboard");
    const supervisor = await sessionUser("supervisor@brennan-twp.example");
    const trustee = await sessionUser("trustee@brennan-twp.example");
    // The server still refuses the supervisor: $5,640.00 is past his $5,000.00 limit.
    await expect(decide(supervisor, wo.id, [{ lineId: moldboard.id, decision: "approve", expectedVersion: moldboard.version }])).rejects.toMatchObject({
      status: 409,
      code: "signing_limit_exceeded",
    });
    // The e-mail is queued in the same transaction as the record of passing the lines on.
    const passed = await passLinesOn(supervisor, { workOrderId: wo.id, toUserId: trustee.id, lineIds: [moldboard.id], note: "Over my limit" }, queuePassedOn);
    expect(passed.lines).toEqual([{ id: moldboard.id, description: moldboard.description, amountCents: 564_000 }]);
    expect((await lineByDescription(wo.id, "Moldboard")).state).toBe("proposed");
    await deliverDueMail();
    const mail = await mailbox.waitFor((m) => m.to.includes("trustee@brennan-twp.example") && m.subject.includes("passed 1 line to you"));
    expect(mail.text).toContain(`/fleet/work-orders/${wo.id}#line-${moldboard.id}`);
    expect(mail.text).toContain("$5,640.00");
    // The colleague can decide it.
    const fresh = await lineByDescription(wo.id, "Moldboard");
    const { result } = await decide(trustee, wo.id, [{ lineId: fresh.id, decision: "approve", expectedVersion: fresh.version }]);
    expect(result.changes[0]!.state).toBe("approved");
  });

  it("refuses a colleague without a higher limit, another account's approver, and lines already decided", async () => {
    const wo = await workOrderByNumber(1042);
    const waiting = (await linesOf(wo.id)).filter((l) => l.state === "proposed");
    const trustee = await sessionUser("trustee@brennan-twp.example");
    const supervisor = await sessionUser("supervisor@brennan-twp.example");
    const quarry = await sessionUser("office@kettle-ridge.example");
    await expect(passLinesOn(trustee, { workOrderId: wo.id, toUserId: supervisor.id, lineIds: [waiting[0]!.id], note: "" })).rejects.toMatchObject({ code: "not_higher_limit" });
    await expect(passLinesOn(supervisor, { workOrderId: wo.id, toUserId: quarry.id, lineIds: [waiting[0]!.id], note: "" })).rejects.toMatchObject({ status: 404 });
    const approved = (await linesOf(wo.id)).find((l) => l.state === "approved")!;
    await expect(passLinesOn(supervisor, { workOrderId: wo.id, toUserId: trustee.id, lineIds: [approved.id], note: "" })).rejects.toMatchObject({ code: "not_pending" });
    // Another account's work order is not found at all.
    await expect(passLinesOn(quarry, { workOrderId: wo.id, toUserId: quarry.id, lineIds: [waiting[0]!.id], note: "" })).rejects.toMatchObject({ status: 404 });
  });
});
