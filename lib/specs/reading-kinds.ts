import { CLAMP_CHAMBER_TYPES } from "./types";
import type { ReadingInputOf, ReadingKind, SourceKind } from "./types";

export interface SelectOption {
  value: string | number;
  label: string;
}

type FieldName<K extends ReadingKind> = Exclude<keyof ReadingInputOf<K>, "kind"> & string;

/** One form field; `name` is the key of the reading input it fills. */
export type FieldSpec<N extends string = string> =
  | { name: N; label: string; type: "number"; unit?: string; optional?: boolean; min?: number; step?: number }
  | { name: N; label: string; type: "select"; options: readonly SelectOption[]; optional?: boolean }
  | { name: N; label: string; type: "date"; optional?: boolean; defaultToday?: boolean };

export interface ReadingKindMeta<K extends ReadingKind = ReadingKind> {
  kind: K;
  label: string;
  unit: string;
  source: string;
  sourceKind: SourceKind;
  fields: readonly FieldSpec<FieldName<K>>[];
}

const TEMPERATURE_UNIT: SelectOption[] = [
  { value: "F", label: "°F" },
  { value: "C", label: "°C" },
];

const PSI_VALUE = { name: "value", label: "Pressure", type: "number", unit: "psi", min: 0, step: 0.5 } as const;
const CDL = "CDL manual, air brakes section";

/** What the UI needs to build a reading form, per kind. */
export const READING_KINDS: { readonly [K in ReadingKind]: ReadingKindMeta<K> } = {
  tread_depth: {
    kind: "tread_depth", label: "Tyre tread depth", unit: "/32 in or mm",
    source: "49 CFR 393.75(b), (c)", sourceKind: "published",
    fields: [
      { name: "position", label: "Axle", type: "select", options: [
        { value: "steer", label: "Front (steering) axle" },
        { value: "other", label: "Other axle" },
      ] },
      { name: "value", label: "Depth in a major groove", type: "number", min: 0, step: 0.5 },
      { name: "unit", label: "Unit", type: "select", options: [
        { value: "32nds", label: "32nds of an inch" },
        { value: "mm", label: "mm" },
      ] },
    ],
  },
  brake_stroke: {
    kind: "brake_stroke", label: "Brake pushrod stroke", unit: "in",
    source: "49 CFR 393.47(e)", sourceKind: "published",
    fields: [
      { name: "chamberType", label: "Clamp-type chamber", type: "select", options: [
        ...CLAMP_CHAMBER_TYPES.map((t) => ({ value: t, label: `Type ${t}` })),
        { value: "other", label: "Other (not in the table)" },
      ] },
      { name: "strokeClass", label: "Stroke", type: "select", options: [
        { value: "standard", label: "Standard" },
        { value: "long_stroke", label: "Long-stroke" },
        { value: "long_stroke_3in", label: "Long-stroke, 3 in rated (type 20, 24)" },
      ] },
      { name: "value", label: "Applied stroke", type: "number", unit: "in", min: 0, step: 0.0625 },
      { name: "ratedStrokeIn", label: "Rated stroke marked on actuator", type: "number", unit: "in", optional: true, min: 0 },
      { name: "markedLimitIn", label: "Readjustment limit marked on actuator", type: "number", unit: "in", optional: true, min: 0 },
    ],
  },
  air_leak: {
    kind: "air_leak", label: "Air leakage", unit: "psi/min", source: CDL, sourceKind: "published",
    fields: [
      { name: "brakes", label: "Brakes", type: "select", options: [
        { value: "released", label: "Released" },
        { value: "applied", label: "Applied (90 psi or more)" },
      ] },
      { name: "vehicle", label: "Vehicle", type: "select", options: [
        { value: "single", label: "Single vehicle" },
        { value: "combination", label: "Combination" },
      ] },
      { name: "value", label: "Loss in one minute", type: "number", unit: "psi/min", min: 0, step: 0.5 },
    ],
  },
  governor_cut_in: {
    kind: "governor_cut_in", label: "Governor cut-in", unit: "psi", source: CDL, sourceKind: "common_practice",
    fields: [PSI_VALUE, { name: "specPsi", label: "Specified cut-in for this unit", type: "number", unit: "psi", optional: true }],
  },
  governor_cut_out: {
    kind: "governor_cut_out", label: "Governor cut-out", unit: "psi", source: CDL, sourceKind: "common_practice",
    fields: [PSI_VALUE, { name: "specPsi", label: "Specified cut-out for this unit", type: "number", unit: "psi", optional: true }],
  },
  low_air_warning: {
    kind: "low_air_warning", label: "Low-air warning comes on at", unit: "psi", source: CDL, sourceKind: "published",
    fields: [PSI_VALUE],
  },
  spring_brake_apply: {
    kind: "spring_brake_apply", label: "Spring brakes apply at", unit: "psi", source: CDL, sourceKind: "published",
    fields: [PSI_VALUE],
  },
  air_buildup: {
    kind: "air_buildup", label: "Air build-up 85 → 100 psi", unit: "s", source: CDL, sourceKind: "published",
    fields: [{ name: "value", label: "Time", type: "number", unit: "s", min: 0, step: 1 }],
  },
  battery_ocv: {
    kind: "battery_ocv", label: "Battery open-circuit voltage", unit: "V",
    source: "BCI state-of-charge table at 80 °F", sourceKind: "common_practice",
    fields: [
      { name: "value", label: "Voltage at rest", type: "number", unit: "V", min: 0, step: 0.01 },
      { name: "temperature", label: "Battery temperature", type: "number", optional: true },
      { name: "temperatureUnit", label: "Temperature unit", type: "select", options: TEMPERATURE_UNIT, optional: true },
    ],
  },
  battery_load_test: {
    kind: "battery_load_test", label: "Battery load test (half CCA, 15 s)", unit: "V",
    source: "Load-test table (common practice)", sourceKind: "common_practice",
    fields: [
      { name: "value", label: "Voltage at 15 s", type: "number", unit: "V", min: 0, step: 0.1 },
      { name: "temperature", label: "Battery temperature", type: "number" },
      { name: "temperatureUnit", label: "Temperature unit", type: "select", options: TEMPERATURE_UNIT, optional: true },
    ],
  },
  cranking_voltage: {
    kind: "cranking_voltage", label: "Cranking voltage", unit: "V", source: "Common practice", sourceKind: "common_practice",
    fields: [{ name: "value", label: "Lowest voltage while cranking", type: "number", unit: "V", min: 0, step: 0.1 }],
  },
  key_off_drain: {
    kind: "key_off_drain", label: "Key-off drain", unit: "mA",
    source: "Unit's configured figure (common practice)", sourceKind: "common_practice",
    fields: [
      { name: "value", label: "Drain", type: "number", unit: "mA", min: 0, step: 1 },
      { name: "minutesAfterKeyOff", label: "Minutes after key-off", type: "number", unit: "min", optional: true, min: 0 },
      { name: "unitLimitMa", label: "This unit's accepted drain", type: "number", unit: "mA", optional: true, min: 0 },
      { name: "warnAboveMa", label: "Warn above", type: "number", unit: "mA", optional: true, min: 0 },
    ],
  },
  annual_inspection: {
    kind: "annual_inspection", label: "Annual inspection due", unit: "days", source: "49 CFR 396.17", sourceKind: "published",
    fields: [
      { name: "lastInspection", label: "Last inspection", type: "date" },
      { name: "basis", label: "Inspection", type: "select", options: [
        { value: "periodic", label: "Periodic (396.17(c)): 12 months from the day" },
        { value: "state", label: "State inspection (396.17(f)): from the month's last day" },
      ] },
      { name: "today", label: "Today", type: "date", defaultToday: true },
    ],
  },
};
