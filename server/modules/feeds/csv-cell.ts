// What one CSV cell holds, made safe for spreadsheets. OWASP "CSV Injection": a cell beginning with =, +, -, @, tab
// or carriage return is read as a formula (=HYPERLINK(...) in a variant becomes a live link), so such a cell gets a
// leading single quote and is quoted. Beyond OWASP's list: whitespace before a trigger counts too, since spreadsheets
// may trim it before they look; a number, or text that is exactly a decimal number ("-12.50"), is left as it is,
// because a spreadsheet reads it as a number and never as a formula.
import type { Cell } from "./columns.ts";

const FORMULA_START = /^(?:[\t\r]|\s*[=+\-@])/u;
const PLAIN_NUMBER = /^-?\d+(?:\.\d+)?$/;

/** Text a spreadsheet will show as text: the cell with a leading ' when it would otherwise start a formula. */
export function neutralise(text: string): string {
  return FORMULA_START.test(text) && !PLAIN_NUMBER.test(text) ? `'${text}` : text;
}

/** Cells neutralise() changed start with ' ; csv-stringify quotes those (quoted_match), as OWASP asks. */
export const NEUTRALISED = /^'/;

/** A CSV cell: lists joined with "|" (photo URLs are percent-encoded, so never contain one), nothing for null. */
export function csvCell(v: Cell): string {
  if (v == null) return "";
  if (typeof v === "number") return String(v);
  return neutralise(Array.isArray(v) ? v.join("|") : v);
}
