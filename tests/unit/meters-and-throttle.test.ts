import { describe, expect, it } from "vitest";
import { throttleVerdict } from "@/lib/auth/throttle-policy";
import { checkMeterReading } from "@/lib/meters";
import { safeNextPath } from "@/lib/http/safe-next";

describe("meter readings (common practice: odometers and hour meters only count up)", () => {
  const previous = { value: 118_420, readAt: "2026-11-01T14:00:00Z" };
  it("accepts equal or higher readings and the first reading", () => {
    expect(checkMeterReading("odometer", previous, { value: 118_420, meterReplaced: false }).ok).toBe(true);
    expect(checkMeterReading("odometer", previous, { value: 118_500, meterReplaced: false }).ok).toBe(true);
    expect(checkMeterReading("odometer", null, { value: 5, meterReplaced: false }).ok).toBe(true);
  });
  it("refuses a lower reading with both numbers in the message", () => {
    const r = checkMeterReading("odometer", previous, { value: 118_419, meterReplaced: false });
    expect(r).toEqual({ ok: false, message: expect.stringContaining("118,419 mi is lower than the last reading, 118,420 mi") });
  });
  it("accepts a lower reading when the meter was replaced", () => {
    expect(checkMeterReading("engine_hours", { value: 9_000, readAt: "" }, { value: 3, meterReplaced: true }).ok).toBe(true);
  });
  it("refuses negative readings even on a new meter", () => {
    expect(checkMeterReading("engine_hours", null, { value: -1, meterReplaced: true }).ok).toBe(false);
  });
});

describe("sign-in throttling policy", () => {
  it("lets the first three failures through at once, then doubles the wait up to 8 s", () => {
    expect([0, 1, 2].map((n) => throttleVerdict(n, 0))).toEqual(Array(3).fill({ kind: "allow", delayMs: 0 }));
    expect([3, 4, 5, 6, 9].map((n) => throttleVerdict(n, 0))).toEqual(
      [1000, 2000, 4000, 8000, 8000].map((delayMs) => ({ kind: "allow", delayMs })),
    );
  });
  it("locks after ten failures until the oldest leaves the 15-minute window", () => {
    expect(throttleVerdict(10, 60_000)).toEqual({ kind: "locked", retryAfterMinutes: 14 });
    expect(throttleVerdict(12, 14.5 * 60_000)).toEqual({ kind: "locked", retryAfterMinutes: 1 });
  });
});

describe("post-sign-in destination stays on this site", () => {
  it.each([
    ["/fleet/units/abc?x=1", "/fleet/units/abc?x=1"],
    ["https://evil.example/steal", "/"],
    ["//evil.example", "/"],
    [undefined, "/"],
  ])("%s → %s", (input, out) => {
    expect(safeNextPath(input)).toBe(out);
  });
});
