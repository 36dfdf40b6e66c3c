// VIN structure and check digit (TRADE.md §1.1–1.2, 49 CFR 565 [S1]).
// The check digit is mandatory only in North America; elsewhere ISO 3779 does
// not require it, so a mismatch there is a warning, never a refusal.
import { normaliseVin, VIN_LENGTH } from "./vin-text.ts";

export { normaliseVin, VIN_LENGTH } from "./vin-text.ts";
export { modelYearFromVin, MODEL_YEAR_CODES } from "./vin-model-year.ts";
export type { ModelYearResult } from "./vin-model-year.ts";

export const CHECK_DIGIT_POSITION = 9;

/** 49 CFR 565.15(c) Table III/IV: letters do not run on alphabetically (S = 2). */
const TRANSLITERATION: Readonly<Record<string, number>> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
  "0": 0, "1": 1, "2": 2, "3": 3, "4": 4, "5": 5, "6": 6, "7": 7, "8": 8, "9": 9,
};

/** 49 CFR 565.15(c) Table V weights; position 9 carries 0. */
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2] as const;

const FORBIDDEN_LETTERS = ["I", "O", "Q"];

export type VinIssueCode = "vin_length" | "vin_forbidden_letter" | "vin_invalid_character" | "vin_check_digit";
export type VinIssueSeverity = "error" | "warning";
export interface VinIssue {
  code: VinIssueCode;
  message: string;
  severity: VinIssueSeverity;
  /** 1-based positions the issue refers to, when it has any. */
  positions?: number[];
}

export type VinStatus = "valid" | "invalid" | "not_applicable";
export interface VinCheckResult {
  status: VinStatus;
  /** The VIN after normalising, or null when there is none. */
  vin: string | null;
  issues: VinIssue[];
  /** True when any issue is an error: the only thing a caller should block on. */
  blocking: boolean;
}

function positionsWhere(vin: string, test: (ch: string) => boolean): number[] {
  return [...vin].flatMap((ch, i) => (test(ch) ? [i + 1] : []));
}

/** Structural issues (length, characters), all severity "error"; [] when sound. */
export function validateVinStructure(vin: string): VinIssue[] {
  const issues: VinIssue[] = [];
  if (vin.length !== VIN_LENGTH) {
    issues.push({
      code: "vin_length",
      severity: "error",
      message: `A VIN has exactly ${VIN_LENGTH} characters; this one has ${vin.length}.`,
    });
  }
  const forbidden = positionsWhere(vin, (ch) => FORBIDDEN_LETTERS.includes(ch));
  if (forbidden.length > 0) {
    issues.push({
      code: "vin_forbidden_letter",
      severity: "error",
      positions: forbidden,
      message: `The letters I, O and Q are never used in a VIN (position ${forbidden.join(", ")}); they are often a misread 1 or 0.`,
    });
  }
  const other = positionsWhere(vin, (ch) => !(ch in TRANSLITERATION) && !FORBIDDEN_LETTERS.includes(ch));
  if (other.length > 0) {
    issues.push({
      code: "vin_invalid_character",
      severity: "error",
      positions: other,
      message: `A VIN holds only digits and the letters A–Z except I, O and Q (position ${other.join(", ")}).`,
    });
  }
  return issues;
}

/**
 * Σ value × weight over the 17 positions; position 9 is ignored (weight 0), so a
 * placeholder such as "?" may stand there. Null when any other character has no value.
 */
export function vinWeightedSum(vin: string): number | null {
  if (vin.length !== VIN_LENGTH) return null;
  let sum = 0;
  for (let i = 0; i < VIN_LENGTH; i++) {
    if (i === CHECK_DIGIT_POSITION - 1) continue;
    const value = TRANSLITERATION[vin[i]];
    if (value === undefined) return null;
    sum += value * WEIGHTS[i];
  }
  return sum;
}

/** The check digit "0"–"9" or "X" (remainder 10), or null when it cannot be computed. */
export function computeCheckDigit(vin: string): string | null {
  const sum = vinWeightedSum(vin);
  if (sum === null) return null;
  const remainder = sum % 11;
  return remainder === 10 ? "X" : String(remainder);
}

/**
 * Status "valid" only when structure and check digit both pass. A failed check
 * digit makes the status "invalid" in every market, but its severity is "error"
 * only when the check digit is mandatory (US, Canada) and "warning" elsewhere;
 * callers block on `blocking`, not on the status.
 */
export function vinCheck(vin: unknown, options: { checkDigitMandatory: boolean }): VinCheckResult {
  const normalised = normaliseVin(vin);
  if (normalised === null) return { status: "not_applicable", vin: null, issues: [], blocking: false };
  const issues = validateVinStructure(normalised);
  if (issues.length === 0) {
    const expected = computeCheckDigit(normalised);
    const actual = normalised[CHECK_DIGIT_POSITION - 1];
    if (expected !== actual) {
      const mandatory = options.checkDigitMandatory;
      issues.push({
        code: "vin_check_digit",
        severity: mandatory ? "error" : "warning",
        positions: [CHECK_DIGIT_POSITION],
        message: mandatory
          ? `The check digit (position 9) is ${actual} but the other characters give ${expected}; re-read the VIN.`
          : `The check digit (position 9) is ${actual} but the North American formula gives ${expected}; outside North America it is not required, so confirm the VIN against the vehicle.`,
      });
    }
  }
  return {
    status: issues.length === 0 ? "valid" : "invalid",
    vin: normalised,
    issues,
    blocking: issues.some((issue) => issue.severity === "error"),
  };
}
