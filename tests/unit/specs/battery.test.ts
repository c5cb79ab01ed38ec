import { describe, expect, it } from "vitest";
import { celsiusToFahrenheit, checkReading, loadTestMinimum, stateOfChargePercent } from "@/lib/specs";

const BCI = "BCI open-circuit voltage table at 80 °F";
const LOAD = "load-test table (common practice)";

describe(`state of charge — ${BCI} (as reprinted in battery makers' technical notes)`, () => {
  it.each([
    [12.65, 100],
    [12.45, 75],
    [12.24, 50],
    [12.06, 25],
    [11.89, 0],
  ])(`${BCI}: %d V is %d %`, (volts, percent) => {
    expect(stateOfChargePercent(volts)).toBe(percent);
  });

  it(`${BCI}: interpolates between rows (12.55 V → 87.5 %, 12.345 V → 62.5 %, 11.975 V → 12.5 %)`, () => {
    expect(stateOfChargePercent(12.55)).toBeCloseTo(87.5, 5);
    expect(stateOfChargePercent(12.345)).toBeCloseTo(62.5, 5);
    expect(stateOfChargePercent(11.975)).toBeCloseTo(12.5, 5);
  });

  it("clamps outside the table (12.8 V → 100 %, 11.5 V → 0 %)", () => {
    expect(stateOfChargePercent(12.8)).toBe(100);
    expect(stateOfChargePercent(11.5)).toBe(0);
  });
});

describe("open-circuit voltage verdict (≥ 75 % within, 50–75 % at_limit, below 50 % beyond — common practice)", () => {
  it("common practice: 12.6 V at 80 °F is within and about 93.8 % charged", () => {
    const r = checkReading({ kind: "battery_ocv", value: 12.6, temperature: 80 });
    expect(r).toMatchObject({ verdict: "within", unit: "V", sourceKind: "common_practice" });
    expect(r.derived?.value).toBeCloseTo(93.8, 5);
  });

  it("edge: exactly 12.45 V (75 %) at 80 °F is within", () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.45 }).verdict).toBe("within");
  });

  it("edge: 12.44 V is at_limit, as is exactly 12.24 V (50 %)", () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.44 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "battery_ocv", value: 12.24 }).verdict).toBe("at_limit");
  });

  it("edge: 12.23 V is beyond", () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.23 }).verdict).toBe("beyond");
  });

  it("with no temperature, 80 °F is assumed and said so", () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.5 }).limit).toContain("80 °F assumed");
  });
});

describe(`temperature correction — ${BCI}: a cold battery reads low, so +0.024 V per 10 °F below 80 °F (− above) before the look-up`, () => {
  it(`${BCI}: at 30 °F a 12.33 V reading corrects to 12.45 V (75 %, within); the raw limit shown is 12.33 V`, () => {
    const r = checkReading({ kind: "battery_ocv", value: 12.33, temperature: 30 });
    expect(r.verdict).toBe("within");
    expect(r.derived?.value).toBeCloseTo(75, 5);
    expect(r.limitValue).toBeCloseTo(12.33, 6);
    expect(r.note).toContain("Corrected to 80 °F: 12.45 V");
  });

  it(`${BCI}: the same 12.35 V reads at_limit at 80 °F but within at 30 °F (a cold battery reads low)`, () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.35, temperature: 80 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "battery_ocv", value: 12.35, temperature: 30 }).verdict).toBe("within");
  });

  it(`${BCI}: 0.024 V per 10 °F is 0.0024 V per °F — at 70 °F, 12.426 V corrects to 12.45 V exactly`, () => {
    expect(checkReading({ kind: "battery_ocv", value: 12.426, temperature: 70 }).verdict).toBe("within");
    expect(checkReading({ kind: "battery_ocv", value: 12.425, temperature: 70 }).verdict).toBe("at_limit");
  });

  it(`${BCI}: above 80 °F the same rate is subtracted (at 100 °F the 75 % line is 12.498 V)`, () => {
    const r = checkReading({ kind: "battery_ocv", value: 12.45, temperature: 100 });
    expect(r.verdict).toBe("at_limit");
    expect(r.limitValue).toBeCloseTo(12.498, 6);
  });

  it("°C converts exactly (F = C × 9/5 + 32): 10 °C = 50 °F, −40 °C = −40 °F", () => {
    expect(celsiusToFahrenheit(10)).toBe(50);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(celsiusToFahrenheit(26.6)).toBeCloseTo(79.88, 10);
    // 10 °C = 50 °F: correction 3 × 0.024 = +0.072 V; 12.378 V corrects to 12.45 V exactly
    expect(checkReading({ kind: "battery_ocv", value: 12.378, temperature: 10, temperatureUnit: "C" }).verdict).toBe("within");
    expect(checkReading({ kind: "battery_ocv", value: 12.377, temperature: 10, temperatureUnit: "C" }).verdict).toBe("at_limit");
  });
});

describe(`load test minimum volts — ${LOAD}: half CCA for 15 s`, () => {
  it.each([
    [70, 9.6],
    [60, 9.5],
    [50, 9.4],
    [40, 9.3],
    [30, 9.1],
    [20, 8.9],
    [10, 8.7],
    [0, 8.5],
  ])(`${LOAD}: %d °F → %d V minimum (exactly at it → at_limit)`, (fahrenheit, volts) => {
    const r = checkReading({ kind: "battery_load_test", value: volts, temperature: fahrenheit });
    expect(r).toMatchObject({ verdict: "at_limit", limitValue: volts, sourceKind: "common_practice" });
    expect(checkReading({ kind: "battery_load_test", value: volts + 0.1, temperature: fahrenheit }).verdict).toBe("within");
    expect(checkReading({ kind: "battery_load_test", value: volts - 0.1, temperature: fahrenheit }).verdict).toBe("beyond");
  });

  it(`${LOAD}: 70 °F and above all use 9.6 V`, () => {
    expect(loadTestMinimum(95_000).volts).toBe(9.6);
  });

  it(`${LOAD} edge: between rows the colder row's value is used (65 °F → 60 °F row, 9.5 V; 59.9 °F → 9.4 V)`, () => {
    expect(loadTestMinimum(65_000).volts).toBe(9.5);
    expect(loadTestMinimum(59_900).volts).toBe(9.4);
    expect(checkReading({ kind: "battery_load_test", value: 9.5, temperature: 69.9 }).verdict).toBe("at_limit");
  });

  it(`${LOAD} edge in °C: 10 °C is exactly 50 °F → 9.4 V; 15 °C (59 °F) → still 9.4 V`, () => {
    expect(checkReading({ kind: "battery_load_test", value: 9.4, temperature: 10, temperatureUnit: "C" }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "battery_load_test", value: 9.4, temperature: 15, temperatureUnit: "C" }).limitValue).toBe(9.4);
    expect(checkReading({ kind: "battery_load_test", value: 9.4, temperature: 15.56, temperatureUnit: "C" }).limitValue).toBe(9.5);
  });

  it("below 0 °F uses the coldest row and says the result is less certain", () => {
    const r = checkReading({ kind: "battery_load_test", value: 8.6, temperature: -10 });
    expect(r).toMatchObject({ verdict: "within", limitValue: 8.5 });
    expect(r.note).toContain("colder than the table");
  });
});

describe("cranking voltage — common practice: electronic injection often will not fire at about 10–10.5 V", () => {
  it("common practice: 11 V cranking is within", () => {
    expect(checkReading({ kind: "cranking_voltage", value: 11 })).toMatchObject({ verdict: "within", limitValue: 10.5, sourceKind: "common_practice" });
  });

  it("common practice edge: exactly 10.5 V and exactly 10 V are at_limit (no-start risk band)", () => {
    expect(checkReading({ kind: "cranking_voltage", value: 10.5 }).verdict).toBe("at_limit");
    expect(checkReading({ kind: "cranking_voltage", value: 10 }).verdict).toBe("at_limit");
  });

  it("common practice edge: 10.51 V within, 9.99 V beyond", () => {
    expect(checkReading({ kind: "cranking_voltage", value: 10.51 }).verdict).toBe("within");
    expect(checkReading({ kind: "cranking_voltage", value: 9.99 }).verdict).toBe("beyond");
  });
});
