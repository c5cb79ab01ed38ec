/**
 * VIN check digit, 49 CFR 565.15(c): each character has a value (digits their
 * own, letters from the regulation's table), each position a weight; the sum of
 * value × weight modulo 11 is the check digit in position 9, remainder 10 → "X".
 * Integer arithmetic throughout: the regulation's printed decimal table has a
 * rounding slip, so it is never used.
 */

const LETTER_VALUES: Readonly<Record<string, number>> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};

const WEIGHTS: readonly number[] = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2];

export const VIN_LENGTH = 17;
export const CHECK_DIGIT_POSITION = 9;

/** Every character that may appear in a VIN (I, O and Q never do). */
export const VIN_ALPHABET = "0123456789ABCDEFGHJKLMNPRSTUVWXYZ";

/** Shown when a unit is recorded as "no VIN / serial only" (a data-model choice, never a silent pass). */
export const NO_VIN_MESSAGE =
  "No 17-character VIN on this unit: record its serial number instead. Units built before 1981, trailers from small builders and off-road equipment often carry only a serial.";

export type VinProblem = "length" | "characters" | "check_digit";

export type VinValidation =
  | { ok: true; vin: string }
  | { ok: false; reason: VinProblem; message: string; expected?: string };

/** Spaces and dashes (hyphen, en and em dashes), as VINs are often written or scanned. */
const SEPARATORS = /[\s\-\u2010-\u2015]+/g;

/**
 * Drop separators, then upper-case a–z only. Never String#toUpperCase on the
 * whole entry: "ß" becomes "SS", "ﬀ" "FF", "ſ" "S", so a 16-character entry
 * could pass as a 17-character VIN. Any other character is left as typed, for
 * validateVin to refuse.
 */
export function normalizeVin(input: string): string {
  return input.replace(SEPARATORS, "").replace(/[a-z]/g, (c) => c.toUpperCase());
}

/** The value of one VIN character, or null for a character no VIN may contain. */
export function vinCharValue(char: string): number | null {
  if (char.length !== 1) return null;
  if (char >= "0" && char <= "9") return char.charCodeAt(0) - 48;
  return LETTER_VALUES[char] ?? null;
}

/**
 * Sum of value × weight over all 17 positions, or null when the text is not 17
 * characters or holds a character no VIN may contain. Position 9 has weight 0,
 * so whatever stands there (even a placeholder) does not change the sum.
 */
export function vinWeightedSum(vin17: string): number | null {
  const vin = vin17.replace(/[a-z]/g, (c) => c.toUpperCase());
  if (vin.length !== VIN_LENGTH) return null;
  let sum = 0;
  for (let i = 0; i < VIN_LENGTH; i += 1) {
    if (i === CHECK_DIGIT_POSITION - 1) continue;
    const value = vinCharValue(vin.charAt(i));
    const weight = WEIGHTS[i];
    if (value === null || weight === undefined) return null;
    sum += value * weight;
  }
  return sum;
}

/** The check digit position 9 should hold ("0"–"9" or "X"), or null when it cannot be computed. */
export function vinCheckDigit(vin17: string): string | null {
  const sum = vinWeightedSum(vin17);
  if (sum === null) return null;
  const remainder = sum % 11;
  return remainder === 10 ? "X" : String(remainder);
}

function describeChar(char: string): string {
  return /^[\x21-\x7e]$/.test(char) ? char : `"${char}"`;
}

function characterProblem(vin: string): string | null {
  for (let i = 0; i < vin.length; i += 1) {
    const char = vin.charAt(i);
    if (char === "I" || char === "O" || char === "Q") {
      const lookalike = char === "I" ? "1 (one)" : "0 (zero)";
      return `VINs never contain I, O or Q (found ${char} at position ${i + 1}); it is probably a ${lookalike}.`;
    }
    if (vinCharValue(char) === null) {
      return `A VIN holds only the letters A–Z and the digits 0–9 (found ${describeChar(char)} at position ${i + 1}).`;
    }
  }
  return null;
}

/** The first character outside 0–9, A–Z and a–z, before any change of case. */
function foreignCharacter(entry: string): string | null {
  const chars = Array.from(entry);
  const at = chars.findIndex((c) => !/^[0-9A-Za-z]$/.test(c));
  if (at < 0) return null;
  return `A VIN holds only the letters A–Z and the digits 0–9 (found ${describeChar(chars[at]!)} at position ${at + 1}).`;
}

export function validateVin(input: string): VinValidation {
  // Refuse foreign characters first, on the entry with only its separators dropped.
  const foreign = foreignCharacter(input.replace(SEPARATORS, ""));
  if (foreign !== null) return { ok: false, reason: "characters", message: foreign };
  const vin = normalizeVin(input);
  if (vin.length !== VIN_LENGTH) {
    const found = vin.length === 0 ? "nothing was entered" : `this one has ${vin.length}`;
    return {
      ok: false,
      reason: "length",
      message: `A VIN has 17 characters; ${found}. If the unit has only a serial number, choose "no VIN / serial only".`,
    };
  }
  const problem = characterProblem(vin);
  if (problem !== null) return { ok: false, reason: "characters", message: problem };
  const expected = vinCheckDigit(vin);
  if (expected === null) {
    return { ok: false, reason: "characters", message: "This VIN holds a character no VIN may contain." };
  }
  if (vin.charAt(CHECK_DIGIT_POSITION - 1) !== expected) {
    return {
      ok: false,
      reason: "check_digit",
      expected,
      message: `Position 9 should be ${expected} for this VIN; check for a mistyped character.`,
    };
  }
  return { ok: true, vin };
}

/** The VIN with position 9 set to its correct check digit (used to make valid demo VINs). */
export function withCheckDigit(vin17: string): string {
  const vin = normalizeVin(vin17);
  const digit = vinCheckDigit(vin);
  if (digit === null) {
    throw new RangeError("withCheckDigit needs 17 VIN characters (position 9 may hold anything)");
  }
  const at = CHECK_DIGIT_POSITION - 1;
  return vin.slice(0, at) + digit + vin.slice(at + 1);
}

export type VinLiveState = "empty" | "typing" | "ok" | "error";

/**
 * What a form shows beside a VIN as it is typed: nothing yet, how far along
 * (no complaint about a VIN not finished), a character no VIN may hold the
 * moment it appears, and at 17 characters the check digit verdict of
 * 49 CFR 565.15(c), naming the digit position 9 should carry when it is wrong.
 */
export function vinLiveCheck(input: string): { state: VinLiveState; message: string; expected?: string } {
  const vin = normalizeVin(input);
  if (vin.length === 0) return { state: "empty", message: "17 characters, checked as you type (49 CFR 565.15(c))." };
  if (vin.length < VIN_LENGTH) {
    for (let i = 0; i < vin.length; i += 1) {
      if (vinCharValue(vin.charAt(i)) === null) {
        const result = validateVin(vin.padEnd(VIN_LENGTH, "0"));
        if (!result.ok && result.reason === "characters") return { state: "error", message: result.message };
      }
    }
    return { state: "typing", message: `${vin.length} of ${VIN_LENGTH} characters.` };
  }
  const result = validateVin(vin);
  if (result.ok) return { state: "ok", message: `Check digit ${vin.charAt(CHECK_DIGIT_POSITION - 1)} matches (49 CFR 565.15(c)).` };
  return { state: "error", message: result.message, ...(result.expected ? { expected: result.expected } : {}) };
}
