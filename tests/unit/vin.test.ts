import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  NO_VIN_MESSAGE,
  VIN_ALPHABET,
  vinLiveCheck,
  normalizeVin,
  validateVin,
  vinCharValue,
  vinCheckDigit,
  vinWeightedSum,
  withCheckDigit,
} from "@/lib/vin";

// Worked examples from /work/shared/reference-values.md; each names its source.
describe("VIN check digit — worked examples (49 CFR 565.15(c))", () => {
  it("49 CFR 565.15(c) Table VI sample 1G4AH59H45G118341: sum 411, check digit 4", () => {
    expect(vinWeightedSum("1G4AH59H45G118341")).toBe(411);
    expect(vinCheckDigit("1G4AH59H45G118341")).toBe("4");
    expect(validateVin("1G4AH59H45G118341")).toEqual({ ok: true, vin: "1G4AH59H45G118341" });
  });

  it("textbook example 1M8GDM9AXKP042788: sum 351, remainder 10 written X", () => {
    expect(vinWeightedSum("1M8GDM9AXKP042788")).toBe(351);
    expect(vinCheckDigit("1M8GDM9AXKP042788")).toBe("X");
    expect(validateVin("1M8GDM9AXKP042788").ok).toBe(true);
  });

  it("all-ones case 11111111111111111: sum 89 (the weights' total), check digit 1, valid", () => {
    expect(vinWeightedSum("11111111111111111")).toBe(89);
    expect(vinCheckDigit("11111111111111111")).toBe("1");
    expect(validateVin("11111111111111111").ok).toBe(true);
  });
});

describe("VIN letter values (49 CFR 565.15(c) table)", () => {
  it("gives each letter the regulation's value and digits their own", () => {
    const expected: Record<string, number> = {
      A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8, J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
      S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
    };
    for (const [letter, value] of Object.entries(expected)) expect(vinCharValue(letter)).toBe(value);
    for (let d = 0; d <= 9; d += 1) expect(vinCharValue(String(d))).toBe(d);
  });

  it("has no value for I, O or Q (49 CFR 565.15(c): never used)", () => {
    expect(vinCharValue("I")).toBeNull();
    expect(vinCharValue("O")).toBeNull();
    expect(vinCharValue("Q")).toBeNull();
    expect(VIN_ALPHABET).not.toMatch(/[IOQ]/);
    expect(VIN_ALPHABET).toHaveLength(33);
  });
});

describe("validateVin — refusals with plain-English reasons", () => {
  it("refuses O and names it and its position (49 CFR 565.15(c): I, O, Q never appear)", () => {
    const result = validateVin("1G4AO59H45G118341");
    expect(result).toMatchObject({ ok: false, reason: "characters" });
    if (!result.ok) expect(result.message).toContain("VINs never contain I, O or Q (found O at position 5)");
  });

  it("refuses I and Q as well", () => {
    const i = validateVin("1G4AH59H45GI18341");
    const q = validateVin("Q1111111111111111");
    expect(i).toMatchObject({ ok: false, reason: "characters" });
    expect(q).toMatchObject({ ok: false, reason: "characters" });
    if (!i.ok) expect(i.message).toContain("found I at position 12");
    if (!q.ok) expect(q.message).toContain("found Q at position 1");
  });

  it("refuses punctuation other than dashes", () => {
    const result = validateVin("1G4AH59H4*G118341");
    expect(result).toMatchObject({ ok: false, reason: "characters" });
    if (!result.ok) expect(result.message).toContain("position 10");
  });

  it("refuses any character outside 0–9 and A–Z before changing case (ß, ﬀ, ſ, full-width letters)", () => {
    // A valid VIN with SS, FF and S in it (check digit by 49 CFR 565.15(c)), typed with look-alikes
    // that upper-case into those letters: a 16-character entry must not pass as a 17-character VIN.
    const vin = withCheckDigit("1FUSSGDR0CFFA1234");
    expect(validateVin(vin)).toEqual({ ok: true, vin });
    const forged = [vin.replace("SS", "ß"), vin.replace("FF", "\ufb00"), vin.replace("S", "\u017f"), vin.replace("A", "\uff21")];
    for (const entry of forged) {
      const result = validateVin(entry);
      expect(result, entry).toMatchObject({ ok: false, reason: "characters" });
      if (!result.ok) expect(result.message).toMatch(/only the letters A–Z and the digits 0–9/);
    }
    const sharp = validateVin(forged[0]!);
    if (!sharp.ok) expect(sharp.message).toContain('found "ß" at position 4');
  });

  it("refuses 16 and 18 characters, saying how many were found", () => {
    const short = validateVin("1G4AH59H45G11834");
    const long = validateVin("1G4AH59H45G1183411");
    expect(short).toMatchObject({ ok: false, reason: "length" });
    expect(long).toMatchObject({ ok: false, reason: "length" });
    if (!short.ok) expect(short.message).toContain("this one has 16");
    if (!long.ok) expect(long.message).toContain("this one has 18");
  });

  it("refuses an empty entry as a length problem and points at the serial-only choice", () => {
    const result = validateVin("   ");
    expect(result).toMatchObject({ ok: false, reason: "length" });
    if (!result.ok) expect(result.message).toContain("no VIN / serial only");
  });

  it("reports the expected check digit when position 9 is wrong (Table VI sample with 5 in position 9)", () => {
    const result = validateVin("1G4AH59H55G118341");
    expect(result).toEqual({
      ok: false,
      reason: "check_digit",
      expected: "4",
      message: "Position 9 should be 4 for this VIN; check for a mistyped character.",
    });
  });

  it("reports X as the expected digit for the textbook example typed with 0 in position 9", () => {
    const result = validateVin("1M8GDM9A0KP042788");
    expect(result).toMatchObject({ ok: false, reason: "check_digit", expected: "X" });
  });

  it("catches a mistyped character elsewhere (Table VI sample, position 17 changed 1 → 2)", () => {
    const result = validateVin("1G4AH59H45G118342");
    expect(result).toMatchObject({ ok: false, reason: "check_digit" });
    // 411 + 2 (weight of position 17) = 413 → 413 mod 11 = 6
    if (!result.ok) expect(result.expected).toBe("6");
  });
});

describe("normalizeVin", () => {
  it("trims, uppercases and drops spaces and dashes", () => {
    expect(normalizeVin("  1g4ah59h45g118341 ")).toBe("1G4AH59H45G118341");
    expect(normalizeVin("1M8-GDM9A-XKP 042788")).toBe("1M8GDM9AXKP042788");
    expect(normalizeVin("1m8\u2013gdm9a xkp\t042788")).toBe("1M8GDM9AXKP042788");
  });

  it("changes the case of a–z only, so no other letter can turn into VIN letters", () => {
    // "ß".toUpperCase() is "SS", "ﬀ" is "FF", "ſ" (long s) is "S": each would forge VIN letters.
    expect(normalizeVin("1g4ßa")).toBe("1G4ßA");
    expect(normalizeVin("ﬀſ")).toBe("ﬀſ");
  });

  it("lets validateVin accept lowercase and dashed entry of a valid VIN", () => {
    expect(validateVin("1m8gdm9axkp042788")).toEqual({ ok: true, vin: "1M8GDM9AXKP042788" });
    expect(validateVin("1G4-AH59-H45G-118341")).toEqual({ ok: true, vin: "1G4AH59H45G118341" });
  });
});

describe("vinCheckDigit / withCheckDigit", () => {
  it("returns null for a text that is not 17 VIN characters", () => {
    expect(vinCheckDigit("1G4AH59H45G11834")).toBeNull();
    expect(vinCheckDigit("1G4AO59H45G118341")).toBeNull();
  });

  it("ignores what stands in position 9 (its weight is 0)", () => {
    expect(vinCheckDigit("1G4AH59H_5G118341")).toBe("4");
    expect(withCheckDigit("1G4AH59H_5G118341")).toBe("1G4AH59H45G118341");
  });

  it("throws for text that cannot become a VIN", () => {
    expect(() => withCheckDigit("1G4AH59H45G1183")).toThrow(RangeError);
    expect(() => withCheckDigit("1G4AO59H45G118341")).toThrow(RangeError);
  });

  it("has a short message for units recorded as no VIN / serial only", () => {
    expect(NO_VIN_MESSAGE).toMatch(/serial/);
    expect(NO_VIN_MESSAGE.length).toBeLessThan(200);
  });
});

const vinChar = fc.constantFrom(...VIN_ALPHABET.split(""));
const vinBody = fc.array(vinChar, { minLength: 17, maxLength: 17 }).map((chars) => chars.join(""));

describe("withCheckDigit — properties over generated VINs (49 CFR 565.15(c) arithmetic)", () => {
  it("always yields a VIN that validateVin accepts, and is idempotent", () => {
    fc.assert(
      fc.property(vinBody, (body) => {
        const vin = withCheckDigit(body);
        expect(validateVin(vin)).toEqual({ ok: true, vin });
        expect(withCheckDigit(vin)).toBe(vin);
        // only position 9 changed
        expect(vin.slice(0, 8) + vin.slice(9)).toBe(body.slice(0, 8) + body.slice(9));
      }),
      { numRuns: 500 },
    );
  });

  it("survives lowercase and dashes", () => {
    fc.assert(
      fc.property(vinBody, fc.integer({ min: 1, max: 16 }), (body, cut) => {
        const vin = withCheckDigit(body);
        const messy = `${vin.slice(0, cut).toLowerCase()}-${vin.slice(cut)} `;
        expect(validateVin(messy)).toEqual({ ok: true, vin });
      }),
      { numRuns: 300 },
    );
  });

  it("catches any single substitution that changes a character's value at a weighted position", () => {
    // 11 is prime and every weight except position 9's is 2–10, so weight × (value change) is never 0 mod 11.
    fc.assert(
      fc.property(vinBody, fc.integer({ min: 0, max: 16 }), vinChar, (body, index, replacement) => {
        fc.pre(index !== 8);
        const vin = withCheckDigit(body);
        const original = vin.charAt(index);
        fc.pre(vinCharValue(original) !== vinCharValue(replacement));
        const typo = vin.slice(0, index) + replacement + vin.slice(index + 1);
        expect(validateVin(typo)).toMatchObject({ ok: false, reason: "check_digit" });
      }),
      { numRuns: 500 },
    );
  });
});

describe("vinLiveCheck: what the form says while a VIN is typed (49 CFR 565.15(c))", () => {
  it("says nothing against a VIN not yet finished, and counts", () => {
    expect(vinLiveCheck("").state).toBe("empty");
    expect(vinLiveCheck("1G4AH59")).toEqual({ state: "typing", message: "7 of 17 characters." });
  });
  it("refuses I, O and Q the moment they are typed", () => {
    const r = vinLiveCheck("1G4AO");
    expect(r.state).toBe("error");
    expect(r.message).toContain("found O at position 5");
  });
  it("at 17 characters gives the check-digit verdict on the worked examples of reference-values.md", () => {
    // The regulation's Table VI sample: sum 411, check digit 4.
    expect(vinLiveCheck("1G4AH59H45G118341")).toMatchObject({ state: "ok", message: "Check digit 4 matches (49 CFR 565.15(c))." });
    // Textbook example: sum 351, remainder 10, written X.
    expect(vinLiveCheck("1M8GDM9AXKP042788").state).toBe("ok");
    // A wrong position 9 names the digit it should carry.
    expect(vinLiveCheck("1M8GDM9A3KP042788")).toMatchObject({ state: "error", expected: "X" });
    expect(vinLiveCheck("1G4AH59H95G118341")).toMatchObject({ state: "error", expected: "4" });
  });
});
