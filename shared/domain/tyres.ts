// Tyre size designation (TRADE.md §2.1, S2 [S16]), e.g. "235/60 R18 103V".
// Age, tread and market rules live in their own files and are re-exported here.
import { loadIndexToKg, speedSymbolToKmh } from "./tyre-tables.ts";
import { MM_PER_INCH } from "./units.ts";

export * from "./tyre-dot.ts";
export * from "./tyre-tread.ts";

export type TyreConstruction = "radial" | "diagonal" | "bias_belted";
export type TyrePrefix = "P" | "LT" | "ST" | "T";

export interface TyreFlags {
  /** "XL" / "Extra Load" (M: a separate flag from "Reinforced"). */
  extraLoad: boolean;
  reinforced: boolean;
  /** "C" after the rim: commercial (UN R54), usually with a dual load index. */
  commercial: boolean;
  lightTruck: boolean;
  /** "ZR": speed capability above 240 km/h. */
  zr: boolean;
  /** Speed symbol in brackets, "(Y)": above 300 km/h. */
  speedAbove300: boolean;
}

export type TyreNoteCode =
  | "zr_without_service_description"
  | "speed_above_300"
  | "high_speed_load_reduction"
  | "load_index_not_in_table"
  | "speed_symbol_not_in_table"
  | "unrecognised_marking";

export interface TyreNote {
  code: TyreNoteCode;
  message: string;
}

export interface TyreSize {
  designation: string;
  prefix: TyrePrefix | null;
  widthMm: number;
  aspectRatio: number;
  construction: TyreConstruction;
  rimInches: number;
  loadIndex: number | null;
  /** Second index of a dual marking such as 109/107 (twin fitment). */
  loadIndexDual: number | null;
  loadKg: number | null;
  loadKgDual: number | null;
  speedSymbol: string | null;
  speedKmh: number | null;
  /** Nominal design diameter; ETRTO/UN R30 allow tolerances (M). */
  overallDiameterMm: number;
  circumferenceMm: number;
  revsPerKm: number;
  flags: TyreFlags;
  notes: TyreNote[];
}

export type TyreSizeError = { code: "empty" | "unrecognised_format" | "invalid_dimension"; message: string };
export type TyreSizeResult = { ok: true; tyre: TyreSize } | { ok: false; error: TyreSizeError };

const SIZE = /^(P|LT|ST|T)?(\d{3})\/(\d{2,3}) ?(Z)?(R|D|B) ?(\d{2}(?:\.\d)?) ?(C)?(?: (.*))?$/;
/** Load index (single or dual) and speed symbol, e.g. 103V, 123/120Q, (94Y), 94(Y). */
const SERVICE = /^(\()?(\d{2,3})(?:\/(\d{2,3}))?(\()?([A-Z])(\))?(\))?$/;

const CONSTRUCTION: Record<string, TyreConstruction> = { R: "radial", D: "diagonal", B: "bias_belted" };
const EXTRA_LOAD = new Set(["XL", "EXTRALOAD"]);
const REINFORCED = new Set(["RF", "REINF", "REINFORCED"]);
const HIGH_SPEED = new Set(["V", "W", "Y"]);

/** D = rim × 25.4 + 2 × width × aspect / 100; circumference πD; revolutions per km 10⁶ / circumference. */
export function tyreGeometry(widthMm: number, aspectRatio: number, rimInches: number) {
  const overallDiameterMm = rimInches * MM_PER_INCH + (2 * widthMm * aspectRatio) / 100;
  const circumferenceMm = Math.PI * overallDiameterMm;
  return { overallDiameterMm, circumferenceMm, revsPerKm: 1_000_000 / circumferenceMm };
}

interface Markings {
  service: RegExpExecArray | null;
  flags: Pick<TyreFlags, "extraLoad" | "reinforced">;
  unrecognised: string[];
}

// Markings after the rim may come in any order ("94W XL", "XL 94W").
function readMarkings(rest: string | undefined): Markings {
  const result: Markings = { service: null, flags: { extraLoad: false, reinforced: false }, unrecognised: [] };
  const tokens = (rest ?? "")
    .replace(/\bEXTRA LOAD\b/g, "XL")
    .replace(/^(\(?\d{2,3}(?:\/\d{2,3})?) (\(?[A-Z]\)?\)?)(?= |$)/, "$1$2") // "103 V" → "103V"
    .split(" ")
    .filter(Boolean);
  for (const token of tokens) {
    const service = result.service ? null : SERVICE.exec(token);
    if (service) result.service = service;
    else if (EXTRA_LOAD.has(token)) result.flags.extraLoad = true;
    else if (REINFORCED.has(token)) result.flags.reinforced = true;
    else result.unrecognised.push(token);
  }
  return result;
}

export function parseTyreSize(input: string | null | undefined): TyreSizeResult {
  const designation = (input ?? "").trim().toUpperCase().replace(/\s+/g, " ").replace(/ ?\/ ?/g, "/");
  if (designation === "") return { ok: false, error: { code: "empty", message: "No tyre size was given." } };
  const m = SIZE.exec(designation);
  if (!m) {
    return {
      ok: false,
      error: { code: "unrecognised_format", message: `"${designation}" is not a metric size such as 235/60 R18 103V.` },
    };
  }
  const [, prefix, width, aspect, z, construction, rim, c, rest] = m;
  const widthMm = Number(width);
  const aspectRatio = Number(aspect);
  const rimInches = Number(rim);
  if (widthMm <= 0 || aspectRatio <= 0 || rimInches <= 0) {
    return { ok: false, error: { code: "invalid_dimension", message: "Width, aspect ratio and rim must all be above zero." } };
  }

  const markings = readMarkings(rest);
  const [, open1, li, li2, open2, symbol, close1, close2] = markings.service ?? [];
  const bracketed = Boolean(open1 || open2) && Boolean(close1 || close2);
  const flags: TyreFlags = {
    ...markings.flags,
    commercial: c === "C",
    lightTruck: prefix === "LT",
    zr: z === "Z",
    speedAbove300: bracketed && symbol === "Y",
  };
  const notes: TyreNote[] = markings.unrecognised.map((token) => ({
    code: "unrecognised_marking",
    message: `Marking "${token}" is kept as written but not interpreted.`,
  }));

  const loadIndex = li ? Number(li) : null;
  const loadIndexDual = li2 ? Number(li2) : null;
  const loadKg = loadIndexToKg(loadIndex);
  const loadKgDual = loadIndexToKg(loadIndexDual);
  if ((loadIndex !== null && loadKg === null) || (loadIndexDual !== null && loadKgDual === null)) {
    notes.push({ code: "load_index_not_in_table", message: "The load index is outside the 60–130 table; check the maker's data." });
  }
  const speedKmh = speedSymbolToKmh(symbol);
  if (symbol && speedKmh === null) {
    notes.push({ code: "speed_symbol_not_in_table", message: `Speed symbol "${symbol}" is not in the table.` });
  }
  if (flags.speedAbove300) {
    notes.push({ code: "speed_above_300", message: "(Y) in brackets: rated above 300 km/h." });
  }
  if (flags.zr && !symbol) {
    notes.push({ code: "zr_without_service_description", message: "ZR without a service description: over 240 km/h; ask the maker." });
  }
  if (symbol && HIGH_SPEED.has(symbol)) {
    notes.push({
      code: "high_speed_load_reduction",
      message: "For V, W and Y tyres the usable load falls above 210 km/h (UN R30 annex; from memory, a note only).",
    });
  }

  return {
    ok: true,
    tyre: {
      designation,
      prefix: (prefix as TyrePrefix | undefined) ?? null,
      widthMm,
      aspectRatio,
      construction: CONSTRUCTION[construction],
      rimInches,
      loadIndex,
      loadIndexDual,
      loadKg,
      loadKgDual,
      speedSymbol: symbol ?? null,
      speedKmh,
      ...tyreGeometry(widthMm, aspectRatio, rimInches),
      flags,
      notes,
    },
  };
}
