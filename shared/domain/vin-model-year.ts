// Model year from VIN position 10 (TRADE.md §1.3). The 30 codes repeat every
// 30 years; the position-7 tie-break (2008 NHTSA rule [S3]) holds only for
// passenger cars and light trucks, so both candidates are always exposed.
import { parseIsoDate } from "./calendar.ts";
import { normaliseVin, VIN_LENGTH } from "./vin-text.ts";

const CODE_ORDER = "ABCDEFGHJKLMNPRSTVWXY123456789";

/** Code → first year of its 30-year cycle (1980–2009); the second is +30. */
export const MODEL_YEAR_CODES: Readonly<Record<string, number>> = Object.fromEntries(
  [...CODE_ORDER].map((code, i) => [code, 1980 + i]),
);

export type ModelYearResult =
  | {
      status: "decoded";
      code: string;
      /** Every year the code can mean, ascending, less any later than today's year + 1 when today is given. */
      candidates: number[];
      /** The position-7 rule's pick for a light vehicle, or the only candidate left. */
      year: number | null;
      /** True when more than one candidate remains, so the pick rests on the light-vehicle rule. */
      ambiguous: boolean;
      basis: "position_7_alphabetic" | "position_7_numeric" | "only_candidate" | "undecided";
    }
  | { status: "invalid_code"; code: string; candidates: []; year: null; ambiguous: false; message: string };

/**
 * Null when there is no 17-character VIN. `today` (optional) removes candidates
 * that cannot yet exist: model years run at most one year ahead of the calendar.
 */
export function modelYearFromVin(vin: unknown, options: { today?: string } = {}): ModelYearResult | null {
  const normalised = normaliseVin(vin);
  if (normalised === null || normalised.length !== VIN_LENGTH) return null;
  const code = normalised[9];
  const first = MODEL_YEAR_CODES[code];
  if (first === undefined) {
    return {
      status: "invalid_code",
      code,
      candidates: [],
      year: null,
      ambiguous: false,
      message: `Invalid year code "${code}": position 10 never uses 0, I, O, Q, U or Z.`,
    };
  }
  const today = parseIsoDate(options.today);
  const latest = today ? today.year + 1 : Infinity;
  const candidates = [first, first + 30].filter((year) => year <= latest);
  const position7 = normalised[6];
  const ruleYear = /[A-Z]/.test(position7) ? first + 30 : /[0-9]/.test(position7) ? first : null;
  if (candidates.length === 1) {
    return { status: "decoded", code, candidates, year: candidates[0], ambiguous: false, basis: "only_candidate" };
  }
  if (ruleYear === null || !candidates.includes(ruleYear)) {
    return { status: "decoded", code, candidates, year: null, ambiguous: candidates.length > 1, basis: "undecided" };
  }
  return {
    status: "decoded",
    code,
    candidates,
    year: ruleYear,
    ambiguous: candidates.length > 1,
    basis: ruleYear > first ? "position_7_alphabetic" : "position_7_numeric",
  };
}
