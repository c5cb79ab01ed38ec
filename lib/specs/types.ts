/** "within": inside the limit; "at_limit": exactly at it (or in a documented caution band); "beyond": past it. */
export type Verdict = "within" | "at_limit" | "beyond";

/** How sure the source is: a regulation or handbook; a fact of the trade; or recalled, not confirmed. */
export type SourceKind = "published" | "common_practice" | "from_memory";

export type TemperatureUnit = "F" | "C";

export type AxlePosition = "steer" | "other";
export type TreadUnit = "32nds" | "mm";

export const CLAMP_CHAMBER_TYPES = [6, 9, 12, 16, 20, 24, 30, 36] as const;
export type ClampChamberType = (typeof CLAMP_CHAMBER_TYPES)[number];
/** "long_stroke_3in": a long-stroke type 20 or 24 chamber with a 3-in rated stroke. */
export type StrokeClass = "standard" | "long_stroke" | "long_stroke_3in";

export interface TreadDepthInput {
  kind: "tread_depth";
  position: AxlePosition;
  value: number;
  unit: TreadUnit;
}

export interface BrakeStrokeInput {
  kind: "brake_stroke";
  /** "other": an actuator not in the 393.47(e)(1) table; give its rated stroke or marked limit. */
  chamberType: ClampChamberType | "other";
  strokeClass: StrokeClass;
  /** Applied pushrod stroke, inches (1.75 for 1¾). */
  value: number;
  ratedStrokeIn?: number;
  markedLimitIn?: number;
}

export interface AirLeakInput {
  kind: "air_leak";
  brakes: "released" | "applied";
  vehicle: "single" | "combination";
  /** psi lost in one minute */
  value: number;
}

interface GovernorFields {
  value: number;
  /** The figure specified for this unit, when the shop has it; otherwise the usual 100 / 125 psi. */
  specPsi?: number;
}

export interface GovernorCutInInput extends GovernorFields {
  kind: "governor_cut_in";
}

export interface GovernorCutOutInput extends GovernorFields {
  kind: "governor_cut_out";
}

export type GovernorInput = GovernorCutInInput | GovernorCutOutInput;

export interface LowAirWarningInput {
  kind: "low_air_warning";
  /** Tank pressure (psi) at which the warning came on. */
  value: number;
}

export interface SpringBrakeApplyInput {
  kind: "spring_brake_apply";
  /** Tank pressure (psi) at which the parking knob popped out. */
  value: number;
}

export interface AirBuildupInput {
  kind: "air_buildup";
  /** Seconds to build from 85 to 100 psi at operating rpm (dual air system). */
  value: number;
}

export interface BatteryOcvInput {
  kind: "battery_ocv";
  /** Open-circuit volts, 12 V flooded lead-acid, surface charge removed. */
  value: number;
  temperature?: number;
  temperatureUnit?: TemperatureUnit;
}

export interface BatteryLoadTestInput {
  kind: "battery_load_test";
  /** Volts at the end of 15 s at half the CCA rating. */
  value: number;
  temperature: number;
  temperatureUnit?: TemperatureUnit;
}

export interface CrankingVoltageInput {
  kind: "cranking_voltage";
  value: number;
}

export interface KeyOffDrainInput {
  kind: "key_off_drain";
  /** milliamps */
  value: number;
  /** The figure configured for this unit (its maker's accepted drain), mA. */
  unitLimitMa?: number;
  /** Warning threshold, mA; 50 unless set. */
  warnAboveMa?: number;
  minutesAfterKeyOff?: number;
}

export type InspectionBasis = "periodic" | "state";

export interface AnnualInspectionInput {
  kind: "annual_inspection";
  /** ISO dates, YYYY-MM-DD. */
  lastInspection: string;
  today: string;
  /** "periodic": 396.17(c), 12 months from the day; "state": 396.17(f), from the last day of that month. */
  basis: InspectionBasis;
}

export type ReadingInput =
  | TreadDepthInput
  | BrakeStrokeInput
  | AirLeakInput
  | GovernorCutInInput
  | GovernorCutOutInput
  | LowAirWarningInput
  | SpringBrakeApplyInput
  | AirBuildupInput
  | BatteryOcvInput
  | BatteryLoadTestInput
  | CrankingVoltageInput
  | KeyOffDrainInput
  | AnnualInspectionInput;

export type ReadingKind = ReadingInput["kind"];

export type ReadingInputOf<K extends ReadingKind> = Extract<ReadingInput, { kind: K }>;

/** A figure worked out from the reading (e.g. state of charge from a voltage). */
export interface DerivedFigure {
  label: string;
  value: number;
  unit: string;
}

export interface ReadingResult {
  kind: ReadingKind;
  value: number;
  unit: string;
  verdict: Verdict;
  /** Human text of the limit used, e.g. "≤ 2 in (type 30, standard stroke)". */
  limit: string;
  /** The limit in the same unit as value. */
  limitValue: number;
  source: string;
  sourceKind: SourceKind;
  note?: string;
  derived?: DerivedFigure;
}
