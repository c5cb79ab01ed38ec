import { describe, expect, it } from "vitest";
import { READING_CAUTION, READING_KINDS, checkReading, tryCheckReading } from "@/lib/specs";
import type { ReadingInput, ReadingKind } from "@/lib/specs";

// One valid sample per kind; the record type makes a missing kind a compile error.
const SAMPLES: { [K in ReadingKind]: Extract<ReadingInput, { kind: K }> } = {
  tread_depth: { kind: "tread_depth", position: "steer", value: 6, unit: "32nds" },
  brake_stroke: { kind: "brake_stroke", chamberType: 30, strokeClass: "standard", value: 1.5 },
  air_leak: { kind: "air_leak", brakes: "released", vehicle: "single", value: 1 },
  governor_cut_in: { kind: "governor_cut_in", value: 100 },
  governor_cut_out: { kind: "governor_cut_out", value: 125 },
  low_air_warning: { kind: "low_air_warning", value: 65 },
  spring_brake_apply: { kind: "spring_brake_apply", value: 35 },
  air_buildup: { kind: "air_buildup", value: 30 },
  battery_ocv: { kind: "battery_ocv", value: 12.6 },
  battery_load_test: { kind: "battery_load_test", value: 10, temperature: 70 },
  cranking_voltage: { kind: "cranking_voltage", value: 11 },
  key_off_drain: { kind: "key_off_drain", value: 20, unitLimitMa: 300 },
  annual_inspection: { kind: "annual_inspection", lastInspection: "2024-03-15", today: "2024-06-01", basis: "periodic" },
};

describe("checkReading dispatch", () => {
  it.each(Object.values(SAMPLES))("checks a $kind reading and returns a full result", (input) => {
    const r = checkReading(input);
    expect(r.kind).toBe(input.kind);
    expect(r.verdict).toBe("within");
    expect(r.limit.length).toBeGreaterThan(0);
    expect(r.source.length).toBeGreaterThan(0);
    expect(["published", "common_practice", "from_memory"]).toContain(r.sourceKind);
    expect(Number.isFinite(r.limitValue)).toBe(true);
  });

  it("tryCheckReading returns input problems as a message instead of throwing", () => {
    expect(tryCheckReading(SAMPLES.air_buildup)).toMatchObject({ ok: true, result: { verdict: "within" } });
    const bad = tryCheckReading({ kind: "air_buildup", value: Number.NaN });
    expect(bad).toEqual({ ok: false, message: "Build-up time must be a number" });
  });

  it("refuses an unknown kind arriving from outside the type system", () => {
    const outcome = tryCheckReading(JSON.parse('{"kind":"coolant_ph","value":8}') as ReadingInput);
    expect(outcome).toEqual({ ok: false, message: "Unknown reading kind: coolant_ph" });
  });
});

describe("READING_KINDS metadata for the form", () => {
  it("describes every kind, keyed by itself", () => {
    expect(Object.keys(READING_KINDS).sort()).toEqual(Object.keys(SAMPLES).sort());
    for (const [kind, meta] of Object.entries(READING_KINDS)) {
      expect(meta.kind).toBe(kind);
      expect(meta.label.length).toBeGreaterThan(0);
      expect(meta.unit.length).toBeGreaterThan(0);
      expect(meta.fields.length).toBeGreaterThan(0);
    }
  });

  it("lists every required field of each sample input, and no field twice", () => {
    for (const [kind, meta] of Object.entries(READING_KINDS)) {
      const names = meta.fields.map((f) => f.name);
      expect(new Set(names).size).toBe(names.length);
      const sample = SAMPLES[kind as ReadingKind];
      for (const key of Object.keys(sample).filter((k) => k !== "kind")) expect(names).toContain(key);
      for (const field of meta.fields.filter((f) => !f.optional)) expect(Object.keys(sample)).toContain(field.name);
    }
  });

  it("offers only select options that checkReading accepts", () => {
    for (const [kind, meta] of Object.entries(READING_KINDS)) {
      for (const field of meta.fields) {
        if (field.type !== "select") continue;
        expect(field.options.length).toBeGreaterThan(0);
        for (const option of field.options) {
          // a rated stroke lets chamber rows that are not in the table be checked too
          const input = { ...SAMPLES[kind as ReadingKind], ratedStrokeIn: 3, [field.name]: option.value } as ReadingInput;
          expect(tryCheckReading(input), `${kind}.${field.name} = ${option.value}`).toMatchObject({ ok: true });
        }
      }
    }
    const chamber = READING_KINDS.brake_stroke.fields.find((f) => f.name === "chamberType");
    expect(chamber?.type === "select" ? chamber.options.map((o) => o.value) : []).toEqual([6, 9, 12, 16, 20, 24, 30, 36, "other"]);
  });
});

describe("READING_CAUTION", () => {
  it("is one line deferring to the maker's procedure, local codes and licensed inspectors", () => {
    expect(READING_CAUTION).not.toContain("\n");
    expect(READING_CAUTION).toMatch(/technician's judgement/);
    expect(READING_CAUTION).toMatch(/maker's procedure, local codes and licensed inspectors decide/);
  });
});
