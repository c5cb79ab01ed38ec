/**
 * Outside temperature for the occurrence log. Stored in °C; people type °F or
 * °C. The scales are related exactly by F = C × 9/5 + 32 (NIST SP 811,
 * Appendix B conversion factors for temperature: t/°C = (t/°F − 32)/1.8).
 */
export type TemperatureUnit = "F" | "C";

export function fahrenheitFromCelsius(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

export function celsiusFromFahrenheit(fahrenheit: number): number {
  return ((fahrenheit - 32) * 5) / 9;
}

/** A stored °C value in the unit a person reads. */
export function inUnit(celsius: number, unit: TemperatureUnit): number {
  return unit === "C" ? celsius : fahrenheitFromCelsius(celsius);
}

/** A typed value in °C, for storage. */
export function toCelsius(value: number, unit: TemperatureUnit): number {
  return unit === "C" ? value : celsiusFromFahrenheit(value);
}

/**
 * Whole thousandths of a degree. Thresholds are compared on these, so 25 °F
 * typed, stored as −3.888… °C and read back as 24.999999999999996 °F is still
 * exactly 25 °F and not "below 25 °F".
 */
export function milliDegrees(value: number): number {
  return Math.round(value * 1000);
}

/** Valid range for a stored outside temperature (the API's contract). */
export const AMBIENT_MIN_C = -60;
export const AMBIENT_MAX_C = 60;

/** −60 °C and 60 °C in °F: −76 °F and 140 °F. */
export const AMBIENT_MIN_F = fahrenheitFromCelsius(AMBIENT_MIN_C);
export const AMBIENT_MAX_F = fahrenheitFromCelsius(AMBIENT_MAX_C);

/** "−4 °F", "12.5 °C": at most one decimal, a true minus sign. */
export function formatTemperature(celsius: number, unit: TemperatureUnit): string {
  return `${formatDegrees(inUnit(celsius, unit))} °${unit}`;
}

export function formatDegrees(value: number): string {
  const rounded = Math.round(value * 10) / 10;
  const text = Number.isInteger(rounded) ? String(rounded) : rounded.toFixed(1);
  return text === "-0" ? "0" : text.replace("-", "−");
}
