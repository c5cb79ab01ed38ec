import { describe, expect, it } from "vitest";
import { boxApprovedMilli, checkClockIn, checkTimeEntry, diagnosisClock, formatClock, formatHours, formatTenths, milliHoursFromSeconds, timeBox, timeBoxNoticesDue } from "@/lib/estimate";
import { approvedLine, line } from "./fixtures";

// Thresholds from /work/shared/product.md, "Authorised limits": warn at 80 %,
// blocked at 100 % of the approved diagnosis hours.

describe("timeBox", () => {
  it("ok below 80 %, warn from 80 %, blocked from 100 %", () => {
    // approved 1.5 h = 1500 milli-hours; 80 % = 1200
    expect(timeBox(1199, 1500)).toEqual({ status: "ok", usedMilli: 1199, approvedMilli: 1500, percent: 79 });
    expect(timeBox(1200, 1500)).toMatchObject({ status: "warn", percent: 80 });
    expect(timeBox(1499, 1500)).toMatchObject({ status: "warn", percent: 99 });
    expect(timeBox(1500, 1500)).toMatchObject({ status: "blocked", percent: 100 });
  });

  it("nothing approved is blocked", () => {
    expect(timeBox(0, 0)).toMatchObject({ status: "blocked", percent: 100 });
  });
});

describe("time entries and clock-ins on a diagnosis line", () => {
  const diag = approvedLine("u-approver", { kind: "labor", quantityMilli: 1000, unitPriceCents: 14_250, isDiagnosis: true });

  it("an entry reaching exactly 100 % is accepted; one passing it is refused", () => {
    expect(checkTimeEntry({ line: diag, usedMilli: 700, addMilli: 300 })).toMatchObject({
      ok: true,
      box: { status: "blocked", percent: 100 },
    });
    const refused = checkTimeEntry({ line: diag, usedMilli: 700, addMilli: 400 });
    expect(refused).toMatchObject({
      ok: false,
      code: "time_box_exceeded",
      amounts: { usedMilli: 700, addMilli: 400, afterMilli: 1100, approvedMilli: 1000 },
    });
    if (!refused.ok) {
      expect(refused.detail).toBe(
        "adding 0.4 h would bring diagnosis time to 1.1 h; the customer approved 1.0 h, so the time box needs extending first",
      );
    }
  });

  it("a clock-in is refused once the box is used up, allowed while in the warning band", () => {
    expect(checkClockIn({ line: diag, usedMilli: 900 })).toMatchObject({ ok: true, box: { status: "warn" } });
    expect(checkClockIn({ line: diag, usedMilli: 1000 })).toMatchObject({ ok: false, code: "time_box_reached" });
  });

  it("a diagnosis line not yet approved has no hours to clock", () => {
    const proposed = line({ kind: "labor", quantityMilli: 1000, isDiagnosis: true });
    expect(checkClockIn({ line: proposed, usedMilli: 0 })).toMatchObject({ ok: false, code: "time_box_reached" });
  });

  it("ordinary lines have no time box", () => {
    const repair = approvedLine("u-approver", { kind: "labor", quantityMilli: 1000 });
    expect(checkTimeEntry({ line: repair, usedMilli: 5000, addMilli: 5000 })).toEqual({ ok: true, box: null });
  });
});

describe("units", () => {
  it("one thousandth of an hour is 3.6 s; partial thousandths round up", () => {
    expect(milliHoursFromSeconds(3600)).toBe(1000);
    expect(milliHoursFromSeconds(36)).toBe(10);
    expect(milliHoursFromSeconds(1)).toBe(1);
  });

  it("formats hours for messages", () => {
    expect(formatHours(1000)).toBe("1.0 h");
    expect(formatHours(1250)).toBe("1.25 h");
    expect(formatHours(400)).toBe("0.4 h");
  });
});

describe("a running clock against the diagnosis time box (product.md: warn at 80 %, stop at 100 %)", () => {
  const T0 = Date.UTC(2026, 11, 2, 14, 0, 0);
  const MIN = 60_000;
  const HOUR = 60 * MIN;

  it("stops by itself at the instant the box fills: 2.0 h approved, 1 h 42 min clocked, one clock running → 18 min later", () => {
    const spans = [
      { startMs: T0 - 5 * HOUR, endMs: T0 - 4 * HOUR },
      { startMs: T0 - 2 * HOUR, endMs: T0 - 2 * HOUR + 42 * MIN },
      { startMs: T0, endMs: null },
    ];
    const c = diagnosisClock({ spans, approvedMilli: 2000, atMs: T0 });
    expect(c.stopAtMs).toBe(T0 + 18 * MIN);
    // 80 % of 2.0 h is 1 h 36 min: already passed, so no warning is scheduled.
    expect(c.warnAtMs).toBeNull();
    expect(c.box.status).toBe("warn");
  });

  it("read long after nobody watched, a clock with its stop time stored shows the truth: 100 %, nothing past the box", () => {
    const spans = [{ startMs: T0, endMs: null, stopAtMs: T0 + 2 * HOUR }];
    const c = diagnosisClock({ spans, approvedMilli: 2000, atMs: T0 + 7 * HOUR });
    expect(c).toMatchObject({ usedMs: 2 * HOUR, usedMilli: 2000, pastMs: 0, stopAtMs: null, box: { status: "blocked", percent: 100 } });
  });

  it("two technicians on one box share what is left: 1 h left → both stop 30 min from now", () => {
    const spans = [
      { startMs: T0 - HOUR, endMs: T0 },
      { startMs: T0, endMs: null },
      { startMs: T0, endMs: null },
    ];
    expect(diagnosisClock({ spans, approvedMilli: 2000, atMs: T0 }).stopAtMs).toBe(T0 + 30 * MIN);
  });

  it("the 80 % warning is due when the running clock reaches 80 % (1.0 h box: at 48 min)", () => {
    const c = diagnosisClock({ spans: [{ startMs: T0, endMs: null }], approvedMilli: 1000, atMs: T0 });
    expect(c.warnAtMs).toBe(T0 + 48 * MIN);
    expect(c.stopAtMs).toBe(T0 + HOUR);
  });

  it("time past the approved hours is kept and counted as past the box, never cut", () => {
    // 1.5 h clocked, then the box was made 1.0 h: 30 min past it.
    const c = diagnosisClock({ spans: [{ startMs: T0, endMs: T0 + 90 * MIN }], approvedMilli: 1000, atMs: T0 + 2 * HOUR });
    expect(c.usedMs).toBe(90 * MIN);
    expect(c.pastMs).toBe(30 * MIN);
    expect(c.box).toMatchObject({ status: "blocked", percent: 150 });
  });

  it("an extension approved by the customer widens the box of the line it extends", () => {
    const diag = approvedLine("u-approver", { id: "d", kind: "labor", quantityMilli: 2000, isDiagnosis: true });
    const ext = approvedLine("u-approver", { id: "e", kind: "labor", quantityMilli: 1000, isDiagnosis: true, extendsLineId: "d" });
    const pending = line({ id: "p", kind: "labor", quantityMilli: 500, isDiagnosis: true, extendsLineId: "d" });
    expect(boxApprovedMilli([diag, ext, pending], "d")).toBe(3000);
  });

  it("notices: warn once per box size, reached once; an extension starts the count again", () => {
    expect(timeBoxNoticesDue(timeBox(1600, 2000), { warnedMilli: null, reachedMilli: null })).toEqual(["warn"]);
    expect(timeBoxNoticesDue(timeBox(1600, 2000), { warnedMilli: 2000, reachedMilli: null })).toEqual([]);
    expect(timeBoxNoticesDue(timeBox(2000, 2000), { warnedMilli: 2000, reachedMilli: null })).toEqual(["reached"]);
    expect(timeBoxNoticesDue(timeBox(2000, 2000), { warnedMilli: 2000, reachedMilli: 2000 })).toEqual([]);
    expect(timeBoxNoticesDue(timeBox(2400, 3000), { warnedMilli: 2000, reachedMilli: 2000 })).toEqual(["warn"]);
  });

  it("clocked time reads as hours and minutes; billed hours in tenths", () => {
    expect(formatClock(1.701 * HOUR)).toBe("1 h 42 min");
    expect(formatClock(65 * 1000)).toBe("1 min");
    expect(formatClock(2 * HOUR)).toBe("2 h");
    expect(formatTenths(2000)).toBe("2.0 h");
    expect(formatTenths(1500)).toBe("1.5 h");
  });
});
