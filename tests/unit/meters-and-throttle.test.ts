import { describe, expect, it } from "vitest";
import { lockedMessage, throttleVerdict } from "@/lib/auth/throttle-policy";
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
  const n = (failures: number, msSinceOldest = 0) => ({ failures, msSinceOldest });
  it("lets an account's first three failures through at once, then doubles the wait up to 8 s", () => {
    expect([0, 1, 2].map((k) => throttleVerdict(n(k)))).toEqual(Array(3).fill({ kind: "allow", delayMs: 0 }));
    expect([3, 4, 5, 6, 9].map((k) => throttleVerdict(n(k)))).toEqual([1000, 2000, 4000, 8000, 8000].map((delayMs) => ({ kind: "allow", delayMs })));
  });
  it("locks an account after ten failures until the oldest leaves the 15-minute window, whatever the address", () => {
    expect(throttleVerdict(n(10, 60_000), n(0))).toEqual({ kind: "locked", scope: "account", retryAfterMinutes: 14 });
    expect(throttleVerdict(n(12, 14.5 * 60_000), n(0))).toEqual({ kind: "locked", scope: "account", retryAfterMinutes: 1 });
  });
  it("counts an address far more leniently, so one office cannot lock its own people out", () => {
    expect(throttleVerdict(n(0), n(10))).toEqual({ kind: "allow", delayMs: 1000 });
    expect(throttleVerdict(n(0), n(49))).toEqual({ kind: "allow", delayMs: 8000 });
    expect(throttleVerdict(n(0), n(50, 0))).toEqual({ kind: "locked", scope: "address", retryAfterMinutes: 15 });
    // The longer wait of the two applies.
    expect(throttleVerdict(n(4), n(11))).toEqual({ kind: "allow", delayMs: 2000 });
  });
  it("words a locked account the same whoever asks", () => {
    expect(lockedMessage({ kind: "locked", scope: "account", retryAfterMinutes: 1 })).toBe(
      "Too many failed sign-ins for this account. Try again in 1 minute, or ask the shop to reset your password.",
    );
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
