import { describe, expect, it } from "vitest";
import { checkClockIn, checkTimeEntry, formatHours, milliHoursFromSeconds, timeBox } from "@/lib/estimate";
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
