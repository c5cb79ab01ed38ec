import { describe, expect, it } from "vitest";
import { daysSincePhrase, summarizePattern, type OccurrencePoint } from "@/lib/occurrences/pattern";
import { celsiusFromFahrenheit } from "@/lib/occurrences/temperature";

// The counts are our own product rule (lib/occurrences/pattern.ts): a threshold is said when it
// covers at least 4 in 5 entries; the expected numbers below are counted by hand from the data.
const NOW = Date.parse("2026-02-20T15:00:00Z");

function entry(day: string, hoursParked: number | null, tempF: number | null, volts: number | null = null, recovered: boolean | null = false): OccurrencePoint {
  return {
    occurredAt: `${day}T12:30:00Z`,
    hoursParked,
    // Stored in °C as the API stores a °F value typed by a driver.
    ambientC: tempF === null ? null : celsiusFromFahrenheit(tempF),
    batteryVolts: volts,
    recovered,
  };
}

/** Six no-starts: five after a long cold soak, one after a short stop (hand-counted fixture). */
const SIX = [
  entry("2026-01-05", 14, 22, 12.1),
  entry("2026-01-12", 11, 18, 11.9),
  entry("2026-01-19", 16, 9),
  entry("2026-01-26", 12.5, -4, 11.7),
  entry("2026-02-02", 62, 15, null, true),
  entry("2026-02-16", 3, 20),
];

describe("pattern summary on fixed data (hand-counted)", () => {
  it("says the issue's example: 5 of 6 after more than 10 h parked, all below 25 °F", () => {
    const s = summarizePattern(SIX, { now: NOW, unit: "F" });
    expect(s.headline).toBe("5 of 6 after more than 10 h parked, all below 25 °F");
    expect(s.total).toBe(6);
    expect(s.parked).toEqual({ known: 6, threshold: 10, over: 5, shortest: 3, longest: 62 });
    expect(s.temperature).toMatchObject({ known: 6, unit: "F", threshold: 25, below: 6, coldest: -4, warmest: 22 });
    expect(s.battery).toEqual({ known: 3, lowest: 11.7, highest: 12.1 });
    expect(s.recovered).toEqual({ yes: 1, no: 5, unknown: 0 });
    expect(s.firstAt).toBe("2026-01-05T12:30:00.000Z");
    expect(s.lastAt).toBe("2026-02-16T12:30:00.000Z");
  });

  it("days since the last one are whole days: Feb 16 12:30 to Feb 20 15:00 is 4", () => {
    expect(summarizePattern(SIX, { now: NOW }).daysSinceLast).toBe(4);
    expect(summarizePattern(SIX, { now: Date.parse("2026-02-17T12:29:59Z") }).daysSinceLast).toBe(0);
    expect(summarizePattern(SIX, { now: Date.parse("2026-02-17T12:30:00Z") }).daysSinceLast).toBe(1);
    // A phone clock a little ahead never gives a negative count.
    expect(summarizePattern(SIX, { now: Date.parse("2026-02-16T12:27:00Z") }).daysSinceLast).toBe(0);
    expect(daysSincePhrase(0)).toBe("today");
    expect(daysSincePhrase(1)).toBe("1 day ago");
    expect(daysSincePhrase(4)).toBe("4 days ago");
  });

  it("reads the same data in °C with 5 °C steps: all below −5 °C (−5.6 °C is the warmest)", () => {
    const s = summarizePattern(SIX, { now: NOW, unit: "C" });
    expect(s.headline).toBe("5 of 6 after more than 10 h parked, all below −5 °C");
    expect(s.temperature.threshold).toBe(-5);
    expect(s.temperature.warmest).toBeCloseTo(-5.556, 3);
    expect(s.temperature.coldest).toBeCloseTo(-20, 6);
  });

  it("edge: exactly 10 h parked is not 'more than 10 h'; exactly 25 °F typed is not 'below 25 °F'", () => {
    const atEdges = [...SIX.slice(0, 4), entry("2026-02-02", 10, 25), entry("2026-02-16", 3, 20)];
    const s = summarizePattern(atEdges, { now: NOW });
    // Only 4 of 6 are over 10 h (10 itself is not), so the statement falls to "more than 8 h".
    expect(s.parked).toMatchObject({ threshold: 8, over: 5 });
    // 25 °F (stored as −3.888… °C) is not below 25: 5 of 6 below 25, so all six below 30 is said.
    expect(s.temperature).toMatchObject({ threshold: 30, below: 6, warmest: 25 });
    expect(s.headline).toBe("5 of 6 after more than 8 h parked, all below 30 °F");
  });

  it("prefers 'all' when it is one step looser than 4 in 5, but not further", () => {
    // Soak times 9, 11, 12, 14, 15, 20: 4 in 5 is > 10 h; all are > 8 h (the next step): say all.
    const close = [9, 11, 12, 14, 15, 20].map((h, i) => entry(`2026-01-${10 + i}`, h, 10));
    expect(summarizePattern(close, { now: NOW }).headline).toBe("All after more than 8 h parked, all below 15 °F");
    // One outlier far below (30 °F among single digits) keeps the tighter statement.
    const outlier = [2, 4, 5, 6, 8, 30].map((t, i) => entry(`2026-01-${10 + i}`, 12, t));
    const s = summarizePattern(outlier, { now: NOW });
    expect(s.temperature).toMatchObject({ threshold: 10, below: 5, known: 6 });
    expect(s.headline).toBe("All after more than 10 h parked, 5 of 6 below 10 °F");
  });

  it("counts only entries that gave a value, and says so", () => {
    const partial = [...SIX, entry("2026-02-18", null, null, null, null)];
    const s = summarizePattern(partial, { now: NOW });
    expect(s.total).toBe(7);
    expect(s.headline).toBe("5 of 6 after more than 10 h parked, all 6 recorded below 25 °F");
    expect(s.recovered).toEqual({ yes: 1, no: 5, unknown: 1 });
    expect(s.lines).toContain("Parked 3–62 h before it happened (6 of 7 gave a time).");
    expect(s.lines).toContain("Outside −4 to 22 °F (6 of 7 gave a temperature).");
    expect(s.lines).toContain("Battery 11.7–12.1 V where measured (3 readings).");
    expect(s.lines).toContain("Came right by itself 1 of 7 times (1 not said).");
  });

  it("needs three entries before calling anything a pattern", () => {
    expect(summarizePattern([], { now: NOW })).toMatchObject({ total: 0, headline: "Nothing logged yet.", daysSinceLast: null, lastAt: null });
    const two = summarizePattern(SIX.slice(0, 2), { now: NOW });
    expect(two.headline).toBe("2 occurrences logged: too few to see a pattern yet.");
    expect(two.parked.threshold).toBeNull();
    expect(two.temperature.threshold).toBeNull();
  });

  it("says there is no clear pattern when soak times and temperatures are all over the place", () => {
    const scattered = [0.5, 0.2, 0.8, 30, 0.1].map((h, i) => entry(`2026-01-${10 + i}`, h, null));
    const s = summarizePattern(scattered, { now: NOW });
    expect(s.parked.threshold).toBeNull();
    expect(s.headline).toBe("5 occurrences logged: no clear pattern in soak time or temperature yet.");
  });
});
