import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  AMBIENT_MAX_F,
  AMBIENT_MIN_F,
  celsiusFromFahrenheit,
  fahrenheitFromCelsius,
  formatTemperature,
  milliDegrees,
  toCelsius,
} from "@/lib/occurrences/temperature";
import { toMilliFahrenheit } from "@/lib/specs/exact";

// NIST SP 811, Appendix B conversion factors (temperature): t/°C = (t/°F − 32)/1.8,
// i.e. F = C × 9/5 + 32 exactly. The checks below compute that formula in exact
// integer arithmetic and compare.
const NIST = "NIST SP 811 App. B: t/°C = (t/°F − 32)/1.8";

/** Exact thousandths of n/d, rounded half away from zero, in BigInt. */
function roundedMilli(num: bigint, den: bigint): number {
  const scaled = num * 1000n;
  const q = scaled / den;
  const r = scaled % den;
  const twice = (r < 0n ? -r : r) * 2n;
  const adjust = twice >= (den < 0n ? -den : den) ? (scaled < 0n ? -1n : 1n) : 0n;
  return Number(q + adjust);
}

describe(`°C → °F against the exact formula (${NIST})`, () => {
  it.each([
    [-40, -40],
    [0, 32],
    [100, 212],
    [-60, -76],
    [60, 140],
    [-20, -4],
    [-5, 23],
  ])(`${NIST}: %d °C is exactly %d °F`, (c, f) => {
    expect(fahrenheitFromCelsius(c)).toBe(f);
    expect(toCelsius(f, "F")).toBe(c);
  });

  it(`${NIST}: every hundredth of a degree from −60 °C to 60 °C converts to the exact thousandth of a °F`, () => {
    for (let n = -6000; n <= 6000; n += 1) {
      // F = n/100 × 9/5 + 32 = (9n + 16000) / 500
      const exact = roundedMilli(BigInt(9 * n + 16_000), 500n);
      expect(milliDegrees(fahrenheitFromCelsius(n / 100))).toBe(exact);
      // The readings module's exact integer conversion agrees.
      expect(toMilliFahrenheit(n / 100, "C")).toBe(exact);
    }
  });
});

describe(`°F → °C against the exact formula (${NIST})`, () => {
  it(`${NIST}: every tenth of a degree from −76 °F to 140 °F converts to the exact thousandth of a °C`, () => {
    for (let m = -760; m <= 1400; m += 1) {
      // C = (m/10 − 32) × 5/9 = (m − 320) × 5 / 90
      const exact = roundedMilli(BigInt((m - 320) * 5), 90n);
      expect(milliDegrees(celsiusFromFahrenheit(m / 10))).toBe(exact);
    }
  });

  it(`${NIST}: 98.6 °F is 37 °C to within a billionth, 25 °F is −3.888… °C`, () => {
    expect(celsiusFromFahrenheit(98.6)).toBeCloseTo(37, 9);
    expect(celsiusFromFahrenheit(25)).toBeCloseTo(-35 / 9, 12);
  });

  it("the valid range in °F is −76 °F to 140 °F (−60 °C to 60 °C, the API's limits)", () => {
    expect(AMBIENT_MIN_F).toBe(-76);
    expect(AMBIENT_MAX_F).toBe(140);
  });
});

describe("round trips", () => {
  it("property: °F typed, stored in °C, read back in °F is the same to the thousandth of a degree", () => {
    fc.assert(
      fc.property(fc.integer({ min: -760, max: 1400 }), (tenths) => {
        const f = tenths / 10;
        expect(milliDegrees(fahrenheitFromCelsius(celsiusFromFahrenheit(f)))).toBe(milliDegrees(f));
      }),
    );
  });

  it("property: °C stored, shown in °F and typed back is the same to the thousandth of a degree", () => {
    fc.assert(
      fc.property(fc.double({ min: -60, max: 60, noNaN: true }), (c) => {
        expect(Math.abs(celsiusFromFahrenheit(fahrenheitFromCelsius(c)) - c)).toBeLessThan(1e-9);
      }),
    );
  });

  it("formats with a true minus sign and at most one decimal", () => {
    expect(formatTemperature(celsiusFromFahrenheit(-4), "F")).toBe("−4 °F");
    expect(formatTemperature(-20, "C")).toBe("−20 °C");
    expect(formatTemperature(celsiusFromFahrenheit(25), "F")).toBe("25 °F");
    expect(formatTemperature(celsiusFromFahrenheit(25), "C")).toBe("−3.9 °C");
    expect(formatTemperature(-0.01, "C")).toBe("0 °C");
  });
});
