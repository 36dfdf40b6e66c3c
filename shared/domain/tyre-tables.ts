// Load index and speed symbol tables, transcribed from TRADE.md §2.2 and §2.3.
// Status S2: cross-checked public tables (primary: ISO 4000-1, UN R30 Annex 4,
// UN R54 Annex IV [S16]). Values are looked up, never derived from order.

export const LOAD_INDEX_SOURCE =
  "ISO 4000-1 / UN R30 Annex 4 / UN R54 Annex IV via cross-checked public tables (TRADE.md §2.2, S2 [S16])";
export const SPEED_SYMBOL_SOURCE =
  "UN R30 speed categories via independent tables and a maker's owner's manual (TRADE.md §2.3, S2 [S16])";

export const LOAD_INDEX_MIN = 60;
export const LOAD_INDEX_MAX = 130;

/** Maximum load per tyre in kg, load index 60–130. */
export const LOAD_INDEX_KG: Readonly<Record<number, number>> = {
  60: 250, 61: 257, 62: 265, 63: 272, 64: 280, 65: 290,
  66: 300, 67: 307, 68: 315, 69: 325, 70: 335, 71: 345,
  72: 355, 73: 365, 74: 375, 75: 387, 76: 400, 77: 412,
  78: 425, 79: 437, 80: 450, 81: 462, 82: 475, 83: 487,
  84: 500, 85: 515, 86: 530, 87: 545, 88: 560, 89: 580,
  90: 600, 91: 615, 92: 630, 93: 650, 94: 670, 95: 690,
  96: 710, 97: 730, 98: 750, 99: 775, 100: 800, 101: 825,
  102: 850, 103: 875, 104: 900, 105: 925, 106: 950, 107: 975,
  108: 1000, 109: 1030, 110: 1060, 111: 1090, 112: 1120, 113: 1150,
  114: 1180, 115: 1215, 116: 1250, 117: 1285, 118: 1320, 119: 1360,
  120: 1400, 121: 1450, 122: 1500, 123: 1550, 124: 1600, 125: 1650,
  126: 1700, 127: 1750, 128: 1800, 129: 1850, 130: 1900,
};

/** In rating order: H (210) sits after U (200), so alphabetical order is wrong. */
export const SPEED_SYMBOLS_KMH: ReadonlyArray<readonly [symbol: string, kmh: number]> = [
  ["L", 120], ["M", 130], ["N", 140], ["P", 150], ["Q", 160], ["R", 170], ["S", 180],
  ["T", 190], ["U", 200], ["H", 210], ["V", 240], ["W", 270], ["Y", 300],
];

const SPEED_KMH: ReadonlyMap<string, number> = new Map(SPEED_SYMBOLS_KMH);

/** kg per tyre, or null when the index is not in the 60–130 table. */
export function loadIndexToKg(loadIndex: number | null | undefined): number | null {
  if (typeof loadIndex !== "number" || !Number.isInteger(loadIndex)) return null;
  return LOAD_INDEX_KG[loadIndex] ?? null;
}

/** km/h, or null for a symbol not in the table. "(Y)" means above 300 km/h; see parseTyreSize. */
export function speedSymbolToKmh(symbol: string | null | undefined): number | null {
  if (typeof symbol !== "string") return null;
  return SPEED_KMH.get(symbol.trim().toUpperCase()) ?? null;
}
