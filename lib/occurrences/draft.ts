import type { Symptom } from "./symptoms";
import type { TemperatureUnit } from "./temperature";

/** A photo already uploaded for the entry: only its id goes in the body; the rest shows it again after a reload. */
export interface DraftPhoto {
  photoId: string;
  name: string;
  url: string;
  thumbUrl: string;
}

/**
 * The fleet's form as typed: strings, so a half-typed "−" or "12," survives a
 * lost signal and a reload exactly as it was. Turned into the API body only
 * when sent.
 */
export interface OccurrenceDraft {
  concernId: string | null;
  /** "now", or a local date-time as an <input type="datetime-local"> holds it. */
  when: string;
  hoursParked: string;
  temperature: string;
  unit: TemperatureUnit;
  symptom: Symptom | "";
  symptomText: string;
  batteryVolts: string;
  recovered: "yes" | "no" | "";
  note: string;
  photo: DraftPhoto | null;
}

export type DraftField = "when" | "hoursParked" | "temperature" | "symptom" | "symptomText" | "batteryVolts" | "note" | "concernId" | "photo";

export function emptyDraft(concernId: string | null, unit: TemperatureUnit): OccurrenceDraft {
  return { concernId, when: "now", hoursParked: "", temperature: "", unit, symptom: "", symptomText: "", batteryVolts: "", recovered: "", note: "", photo: null };
}

/** A draft kept on the phone by an earlier version of the form, filled out to today's shape. */
export function restoreDraft(kept: Partial<OccurrenceDraft>, fallback: OccurrenceDraft): OccurrenceDraft {
  return { ...fallback, ...kept, photo: kept.photo ?? null };
}

/** True when the person has entered anything worth keeping. */
export function draftHasContent(d: OccurrenceDraft): boolean {
  return d.when !== "now" || d.photo !== null || [d.hoursParked, d.temperature, d.symptom, d.symptomText, d.batteryVolts, d.recovered, d.note].some((v) => v.trim() !== "");
}

/**
 * A number as people type it on a phone: a true minus (−) or a hyphen, a comma
 * or a point for decimals, spaces ignored. "" is "not given"; anything else
 * that is not a number is NaN.
 */
export function parseTyped(text: string): number | null {
  const t = text.replace(/\s+/g, "").replace(/[−–]/g, "-").replace(",", ".");
  if (t === "") return null;
  if (!/^-?(\d+\.?\d*|\.\d+)$/.test(t)) return Number.NaN;
  return Number(t);
}

/** Flips the sign of a typed temperature: the minus key is missing on many phone keypads. */
export function toggleSign(text: string): string {
  const t = text.trim();
  if (t.startsWith("−") || t.startsWith("-")) return t.slice(1);
  return `−${t}`;
}

/** A local date-time for <input type="datetime-local">, e.g. "2026-01-05T06:12". */
export function toLocalInput(instant: number): string {
  const d = new Date(instant);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

export interface DraftBody {
  occurredAt: string;
  hoursParked?: number;
  ambientC?: number;
  ambientF?: number;
  symptom: string;
  symptomText?: string;
  batteryVolts?: number;
  recovered?: boolean;
  note?: string;
  concernId?: string;
  photoId?: string;
}

/**
 * The API body for a draft, or the fields that cannot be read as typed. Range
 * checks are the shared schema's (lib/validation/occurrence.ts); this only
 * turns text into numbers. `parseLocal` reads a datetime-local value in the
 * phone's own time zone.
 */
export function draftToBody(
  d: OccurrenceDraft,
  now: number,
  parseLocal: (value: string) => number = (v) => new Date(v).getTime(),
): { ok: true; body: DraftBody } | { ok: false; errors: Partial<Record<DraftField, string>> } {
  const errors: Partial<Record<DraftField, string>> = {};
  const at = d.when === "now" ? now : parseLocal(d.when);
  if (!Number.isFinite(at)) errors.when = "Give the date and time it happened.";
  const hours = parseTyped(d.hoursParked);
  if (Number.isNaN(hours)) errors.hoursParked = "Hours parked as a number, e.g. 12 or 7.5.";
  const temperature = parseTyped(d.temperature);
  if (Number.isNaN(temperature)) errors.temperature = `Temperature as a number of °${d.unit}, e.g. 18 or −4.`;
  const volts = parseTyped(d.batteryVolts);
  if (Number.isNaN(volts)) errors.batteryVolts = "Voltage as a number, e.g. 12.4.";
  if (!d.symptom) errors.symptom = "Tap what it did.";
  if (Object.keys(errors).length) return { ok: false, errors };

  const body: DraftBody = { occurredAt: new Date(at).toISOString(), symptom: d.symptom };
  if (hours !== null) body.hoursParked = hours;
  if (temperature !== null) body[d.unit === "C" ? "ambientC" : "ambientF"] = temperature;
  if (volts !== null) body.batteryVolts = volts;
  if (d.symptomText.trim()) body.symptomText = d.symptomText.trim();
  if (d.recovered) body.recovered = d.recovered === "yes";
  if (d.note.trim()) body.note = d.note.trim();
  if (d.concernId) body.concernId = d.concernId;
  if (d.photo) body.photoId = d.photo.photoId;
  return { ok: true, body };
}

/** Where a field error from the API belongs on the form. */
export function draftFieldOf(apiPath: string): DraftField | null {
  switch (apiPath) {
    case "occurredAt":
      return "when";
    case "ambientC":
    case "ambientF":
      return "temperature";
    case "hoursParked":
    case "batteryVolts":
    case "symptom":
    case "symptomText":
    case "note":
    case "concernId":
      return apiPath;
    case "photoId":
      return "photo";
    default:
      return null;
  }
}
