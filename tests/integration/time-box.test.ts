// The diagnosis time box against a running clock (product.md, "Authorised limits": warned at
// 80 %, stopped at 100 % until the customer extends it). Recorded time is a fact: it is never cut
// back. Demo: W-1043 (T-9), 2.0 h of diagnosis approved by the road supervisor, 1 h 42 min clocked.
import { and, eq, isNull } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb, writeTx } from "@/db/client";
import { decide } from "@/db/queries/decisions";
import { askForMoreDiagnosisTime } from "@/db/queries/time-box-extension";
import { clockOfGroup, loadBoxGroup, settleTimeBoxes } from "@/db/queries/time-box-stops";
import { clockIn, clockOut } from "@/db/queries/time-clock";
import { estimateLines, timeEntries } from "@/db/schema";
import { deliverDueMail } from "@/lib/server/mail/worker";
import { queueTimeBoxNotice } from "@/lib/server/notifications/time-box";
import { checkTimeBoxes } from "@/lib/server/notifications/time-box-watch";
import { sessionUser } from "./helpers/app";
import { fileMailbox } from "./helpers/mail";
import { lineByDescription, workOrderByNumber } from "./helpers/work-orders";

const mailbox = fileMailbox();

const MIN = 60_000;
const tech = () => sessionUser("tech@quarry-road.example");
const writer = () => sessionUser("writer@quarry-road.example");
const supervisor = () => sessionUser("supervisor@brennan-twp.example");
const iso = (ms: number) => new Date(ms).toISOString();

async function diagnosis() {
  const wo = await workOrderByNumber(1043);
  return { wo, line: await lineByDescription(wo.id, "Diagnose no-start") };
}

async function runningEntry(lineId: string) {
  const [row] = await getDb().select().from(timeEntries).where(and(eq(timeEntries.lineId, lineId), isNull(timeEntries.endedAt)));
  return row ?? null;
}

describe("a running diagnosis clock and its time box", () => {
  it("stores the instant the clock stops by itself (18 min left of 2.0 h), warns at once past 80 %, and stops there with nobody watching", async () => {
    const { line } = await diagnosis();
    const { entry, notices } = await clockIn(await tech(), line.id);
    const started = Date.parse(entry.startedAt);
    // 2.0 h − 1 h 42 min = 18 min, to the millisecond.
    expect(Date.parse(entry.stopAt!)).toBe(started + 18 * MIN);
    expect(notices.map((n) => n.kind)).toEqual(["warn"]);

    // Nobody clocks out. Half an hour later every read shows the truth: stopped at the box.
    const later = started + 30 * MIN;
    const read = clockOfGroup(await loadBoxGroup(getDb(), line.id), later);
    expect(read).toMatchObject({ usedMilli: 2000, pastMs: 0, box: { status: "blocked", percent: 100 } });

    // The watcher's settle closes it at the stop instant (never later) and says who is told.
    const due = await writeTx((tx) => settleTimeBoxes(tx, iso(later)));
    expect(due).toMatchObject([{ kind: "reached", rootLineId: line.id, approvedMilli: 2000 }]);
    const [closed] = await getDb().select().from(timeEntries).where(eq(timeEntries.id, entry.id));
    expect(closed).toMatchObject({ endedAt: entry.stopAt, stoppedBy: "time_box" });
    // Each notice goes once.
    expect(await writeTx((tx) => settleTimeBoxes(tx, iso(later + MIN), [line.id]))).toEqual([]);

    // Clocking in waits for an extension; clocking out says it had already stopped, and keeps the time.
    await expect(clockIn(await tech(), line.id)).rejects.toMatchObject({ status: 409, code: "time_box_reached" });
    const out = await clockOut(await tech(), line.id);
    expect(out.stoppedByBoxAt).toBe(entry.stopAt);
  });

  it("e-mails the technician's phone and the writer at 80 % and at 100 % (and the approvers at 100 %)", async () => {
    const { wo, line } = await diagnosis();
    const base = { rootLineId: line.id, workOrderId: wo.id, description: line.description, approvedMilli: 2000, techIds: [(await tech()).id] };
    await writeTx((tx) => queueTimeBoxNotice(tx, { ...base, kind: "warn", usedMs: 96 * MIN }));
    await deliverDueMail();
    const warnTech = await mailbox.waitFor((m) => m.subject.includes("80 % of the diagnosis time used") && m.to.includes("tech@quarry-road.example"));
    await mailbox.waitFor((m) => m.subject.includes("80 % of the diagnosis time used") && m.to.includes("writer@quarry-road.example"));
    expect(warnTech.text).toContain("1 h 36 min of the 2.0 h approved");
    expect(warnTech.text).toContain(`/work-orders/${wo.id}`);
    await writeTx((tx) => queueTimeBoxNotice(tx, { ...base, kind: "reached", usedMs: 120 * MIN }));
    await deliverDueMail();
    await mailbox.waitFor((m) => m.subject.includes("the clock stopped") && m.to.includes("tech@quarry-road.example"));
    await mailbox.waitFor((m) => m.subject.includes("the clock stopped") && m.to.includes("writer@quarry-road.example"));
    const fleet = await mailbox.waitFor((m) => m.subject.includes("the clock stopped") && m.to.includes("supervisor@brennan-twp.example"));
    expect(fleet.text).toContain(`/fleet/work-orders/${wo.id}`);
  });

  it("the writer asks for more hours in one step; once the approver approves, the box is wider and the clock runs again", async () => {
    const { wo, line } = await diagnosis();
    const asked = await askForMoreDiagnosisTime(await writer(), { lineId: line.id, hours: 1000, note: "Drain still unexplained after the fuse pull" });
    const [ext] = await getDb().select().from(estimateLines).where(eq(estimateLines.id, asked.lineId));
    expect(ext).toMatchObject({ state: "proposed", extendsLineId: line.id, isDiagnosis: true, quantityMilli: 1000, unitPriceCents: line.unitPriceCents });
    // The approved diagnosis and the time on it are untouched while the customer decides.
    expect((await lineByDescription(wo.id, "Diagnose no-start")).state).toBe("in_progress");
    expect(clockOfGroup(await loadBoxGroup(getDb(), line.id), Date.now()).approvedMilli).toBe(2000);

    await decide(await supervisor(), wo.id, [{ lineId: ext!.id, decision: "approve", expectedVersion: ext!.version }]);
    expect(clockOfGroup(await loadBoxGroup(getDb(), line.id), Date.now()).approvedMilli).toBe(3000);
    const { entry } = await clockIn(await tech(), line.id);
    expect(Date.parse(entry.stopAt!) - Date.parse(entry.startedAt)).toBe(60 * MIN);
  });

  it("clock-out never cuts recorded time: a clock that ran past the box keeps every minute, shown as past the box", async () => {
    const { line } = await diagnosis();
    const open = await runningEntry(line.id);
    // A clock nobody could stop (started long ago, no stop time stored): 1 h 40 min running.
    await getDb().update(timeEntries).set({ startedAt: iso(Date.now() - 100 * MIN), stopAt: null }).where(eq(timeEntries.id, open!.id));
    await clockOut(await tech(), line.id);
    const [kept] = await getDb().select().from(timeEntries).where(eq(timeEntries.id, open!.id));
    expect(Date.parse(kept!.endedAt!) - Date.parse(kept!.startedAt)).toBeGreaterThanOrEqual(100 * MIN);
    expect(kept!.stoppedBy).toBe("tech");
    const clock = clockOfGroup(await loadBoxGroup(getDb(), line.id), Date.now());
    // 2 h + 1 h 40 min clocked against 3.0 h approved: 40 min past the box.
    expect(Math.round(clock.pastMs / MIN)).toBe(40);
  });

  it("the watcher stops a clock whose time came while the server was not looking", async () => {
    const wo = await workOrderByNumber(1045); // H-7, leak-down test: 0.8 h approved under the standing authorisation
    const line = await lineByDescription(wo.id, "Leak-down test");
    await getDb().update(estimateLines).set({ state: "in_progress" }).where(eq(estimateLines.id, line.id));
    const [entry] = await getDb()
      .insert(timeEntries)
      .values({ lineId: line.id, workOrderId: wo.id, techId: (await tech()).id, startedAt: iso(Date.now() - 60 * MIN), stopAt: iso(Date.now() - 12 * MIN) })
      .returning();
    const notices = await checkTimeBoxes();
    expect(notices.map((n) => [n.kind, n.rootLineId])).toContainEqual(["reached", line.id]);
    const [closed] = await getDb().select().from(timeEntries).where(eq(timeEntries.id, entry!.id));
    expect(closed).toMatchObject({ endedAt: entry!.stopAt, stoppedBy: "time_box" });
  });
});
