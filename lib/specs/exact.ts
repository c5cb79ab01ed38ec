import type { TemperatureUnit, Verdict } from "./types";

/** Thrown (or returned by tryCheckReading) when a reading cannot be checked as entered. */
export class ReadingInputError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = "ReadingInputError";
  }
}

export function requireNumber(value: number, what: string, options: { min?: number } = {}): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new ReadingInputError(`${what} must be a number`);
  }
  if (options.min !== undefined && value < options.min) {
    throw new ReadingInputError(`${what} cannot be below ${options.min}`);
  }
  return value;
}

/**
 * value × 10^decimals as a whole number. Readings and limits are compared as
 * integers so that 1.375 in against 1⅜ in, or 3.175 mm against 4/32 in, is an
 * exact tie and never a binary-fraction near miss.
 */
export function toUnits(value: number, decimals: number): number {
  const units = Math.round(value * 10 ** decimals);
  if (!Number.isSafeInteger(units)) throw new ReadingInputError(`${value} is out of range`);
  return units;
}

/** For a "must not be greater than" limit: equal is allowed (at_limit), more is beyond. */
export function verdictForMaximum(value: number, limit: number): Verdict {
  if (value < limit) return "within";
  return value === limit ? "at_limit" : "beyond";
}

/** For a "less than" limit (a figure that must not be reached): equal is beyond, there is no at_limit. */
export function verdictForLessThan(value: number, limit: number): Verdict {
  return value < limit ? "within" : "beyond";
}

/** For an "at least" limit: equal is allowed (at_limit), less is beyond. */
export function verdictForMinimum(value: number, limit: number): Verdict {
  if (value > limit) return "within";
  return value === limit ? "at_limit" : "beyond";
}

/** 2.5 → "2.5", 12.450 → "12.45", 3.1750 → "3.175" (at most `decimals` places). */
export function formatNumber(value: number, decimals = 3): string {
  const text = value.toFixed(decimals);
  const trimmed = text.includes(".") ? text.replace(/0+$/, "").replace(/\.$/, "") : text;
  return trimmed === "-0" ? "0" : trimmed;
}

const EIGHTHS = ["", "⅛", "¼", "⅜", "½", "⅝", "¾", "⅞"] as const;

/** Inches as a shop writes them: 1.75 → "1¾", 2 → "2"; other values as decimals. */
export function formatInches(inches: number): string {
  const eighths = inches * 8;
  if (inches >= 0 && Number.isInteger(eighths)) {
    const whole = Math.trunc(eighths / 8);
    const fraction = EIGHTHS[eighths % 8] ?? "";
    if (fraction === "") return String(whole);
    return whole === 0 ? fraction : `${whole}${fraction}`;
  }
  return formatNumber(inches, 4);
}

export function celsiusToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

/**
 * Temperature as whole thousandths of a °F. °C is taken to 0.01 °C and converted
 * exactly (F = C × 9/5 + 32: 0.01 °C is 18 thousandths of a °F).
 */
export function toMilliFahrenheit(value: number, unit: TemperatureUnit = "F"): number {
  requireNumber(value, "Temperature", { min: unit === "F" ? -459.67 : -273.15 });
  if (unit === "F") return toUnits(value, 3);
  return toUnits(value, 2) * 18 + 32_000;
}

export function formatTemperature(value: number, unit: TemperatureUnit = "F"): string {
  if (unit === "F") return `${formatNumber(value, 1)} °F`;
  return `${formatNumber(value, 1)} °C (${formatNumber(celsiusToFahrenheit(value), 1)} °F)`;
}
