import { describe, expect, it } from "vitest";
import { draftToInput, newReadingDraft } from "@/components/findings/form/reading-draft";
import { READING_KINDS, checkReading, type ReadingKind } from "@/lib/specs";
import { findingInput, readingEntry } from "@/lib/validation/finding";
import { statusMoveInput } from "@/lib/validation/status";

describe("readingEntry: the typed input, nothing the phone says about the verdict", () => {
  it("keeps the typed brake-stroke input and drops a verdict sent with it", () => {
    const parsed = readingEntry.parse({
      kind: "brake_stroke",
      location: " Axle 2, right ",
      chamberType: 30,
      strokeClass: "standard",
      value: 2.25,
      verdict: "within",
      limit: "≤ 9 in",
    });
    expect(parsed).toEqual({ location: "Axle 2, right", input: { kind: "brake_stroke", chamberType: 30, strokeClass: "standard", value: 2.25 } });
    // 49 CFR 393.47(e)(1): type 30 standard stroke, 2 in; 2¼ in is beyond it.
    expect(checkReading(parsed.input).verdict).toBe("beyond");
  });

  it("refuses unknown kinds, options that are not offered, and text where a number belongs, naming the field", () => {
    expect(readingEntry.safeParse({ kind: "tyre_pressure", value: 100 }).success).toBe(false);
    const chamber = readingEntry.safeParse({ kind: "brake_stroke", chamberType: 31, strokeClass: "standard", value: 2 });
    expect(chamber.success).toBe(false);
    expect(chamber.error?.issues[0]?.path).toEqual(["chamberType"]);
    const text = readingEntry.safeParse({ kind: "tread_depth", position: "steer", value: "five", unit: "32nds" });
    expect(text.error?.issues[0]).toMatchObject({ path: ["value"], message: "Depth in a major groove: enter a number." });
    expect(readingEntry.safeParse({ kind: "tread_depth", position: "steer", unit: "32nds" }).success).toBe(false);
  });

  it("accepts, for every kind the form offers, what the form sends (built from the same READING_KINDS)", () => {
    // One plausible reading per kind, typed as a technician would (values from reference-values.md's ranges).
    const typed: Record<ReadingKind, Record<string, string>> = {
      tread_depth: { value: "5" },
      brake_stroke: { value: "1.5" },
      air_leak: { value: "1.5" },
      governor_cut_in: { value: "101" },
      governor_cut_out: { value: "124" },
      low_air_warning: { value: "62" },
      spring_brake_apply: { value: "35" },
      air_buildup: { value: "40" },
      battery_ocv: { value: "12.5", temperature: "70" },
      battery_load_test: { value: "9.8", temperature: "70" },
      cranking_voltage: { value: "10.8" },
      key_off_drain: { value: "35" },
      annual_inspection: { lastInspection: "2020-03-01" },
    };
    for (const kind of Object.keys(READING_KINDS) as ReadingKind[]) {
      const draft = newReadingDraft(kind);
      const filled = { ...draft, location: "Somewhere", values: { ...draft.values, ...typed[kind] } };
      const parsed = readingEntry.safeParse(draftToInput(filled));
      expect(parsed.success, `${kind}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
      if (parsed.success) expect(() => checkReading(parsed.data.input)).not.toThrow();
    }
  });
});

describe("findingInput", () => {
  const base = { title: "Hub seal weeping", severity: "plan" };

  it("fills defaults and trims the title", () => {
    expect(findingInput.parse({ ...base, title: "  Hub seal weeping " })).toEqual({
      title: "Hub seal weeping",
      severity: "plan",
      noteMarkdown: "",
      photoIds: [],
      readings: [],
      proposedLines: [],
    });
  });

  it("refuses a ninth photo, the same photo twice, and an unknown severity", () => {
    expect(findingInput.safeParse({ ...base, photoIds: Array.from({ length: 9 }, (_, i) => `p${i}`) }).success).toBe(false);
    expect(findingInput.safeParse({ ...base, photoIds: ["p1", "p1"] }).success).toBe(false);
    expect(findingInput.safeParse({ ...base, severity: "red" }).success).toBe(false);
  });

  it("takes labour in tenths of an hour (trade convention) and parts to three decimals", () => {
    const ok = findingInput.safeParse({
      ...base,
      proposedLines: [
        { description: "Reseal hub", kind: "labor", quantity: 1.5 },
        { description: "Gear oil, quarts", kind: "part", quantity: 2.125 },
      ],
    });
    expect(ok.success).toBe(true);
    const labour = findingInput.safeParse({ ...base, proposedLines: [{ description: "Reseal hub", kind: "labor", quantity: 1.25 }] });
    expect(labour.error?.issues[0]?.message).toBe("Labour is in tenths of an hour (e.g. 1.5).");
    expect(findingInput.safeParse({ ...base, proposedLines: [{ description: "Oil", kind: "part", quantity: 0.0005 }] }).success).toBe(false);
  });
});

describe("statusMoveInput", () => {
  it("takes the eight statuses of api-v1.md and a trimmed note", () => {
    expect(statusMoveInput.parse({ status: "waiting_parts", note: "  Parts Thursday. " })).toEqual({ status: "waiting_parts", note: "Parts Thursday." });
    expect(statusMoveInput.parse({ status: "released" })).toEqual({ status: "released", note: "" });
    expect(statusMoveInput.safeParse({ status: "Waiting on parts" }).success).toBe(false);
  });
});
