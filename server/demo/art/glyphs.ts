/**
 * A digital-readout lettering drawn with strokes (no fonts): segment digits plus the few letters an odometer needs
 * ("km", "mi"). Unknown characters leave a gap.
 */
import type { P2 } from "./geometry.ts";

// Glyph strokes in a 1 × 2 cell (x right, y down).
const SEG: Record<string, P2[]> = {
  a: [[0.1, 0], [0.9, 0]], b: [[1, 0.1], [1, 0.9]], c: [[1, 1.1], [1, 1.9]], d: [[0.1, 2], [0.9, 2]],
  e: [[0, 1.1], [0, 1.9]], f: [[0, 0.1], [0, 0.9]], g: [[0.1, 1], [0.9, 1]],
};
const DIGITS: Record<string, string> = {
  "0": "abcdef", "1": "bc", "2": "abged", "3": "abgcd", "4": "fgbc", "5": "afgcd", "6": "afgedc", "7": "abc", "8": "abcdefg", "9": "abcdfg",
  "-": "g",
};
const LETTERS: Record<string, P2[][]> = {
  k: [[[0, 0], [0, 2]], [[0.85, 0.9], [0.05, 1.45]], [[0.3, 1.3], [0.9, 2]]],
  m: [[[0, 0.95], [0, 2]], [[0, 1.05], [0.3, 0.95], [0.5, 1.1], [0.5, 2]], [[0.5, 1.1], [0.7, 0.95], [1, 1.05], [1, 2]]],
  i: [[[0.5, 1], [0.5, 2]], [[0.5, 0.55], [0.5, 0.6]]],
  ".": [[[0.5, 1.95], [0.5, 2]]],
  ",": [[[0.55, 1.85], [0.4, 2.15]]],
};

/** Stroke polylines for `text`, laid out from (x, y) with cell height `h` (width h/2, advance 0.72 h). */
export function glyphStrokes(text: string, x: number, y: number, h: number): P2[][] {
  const s = h / 2;
  const out: P2[][] = [];
  let cx = x;
  for (const ch of text.toLowerCase()) {
    const place = (pts: P2[]) => pts.map(([u, v]): P2 => [cx + u * s, y + v * s]);
    if (DIGITS[ch]) for (const k of DIGITS[ch]) out.push(place(SEG[k]));
    else if (LETTERS[ch]) for (const p of LETTERS[ch]) out.push(place(p));
    cx += ch === " " ? h * 0.4 : h * 0.72;
  }
  return out;
}

export function glyphAdvance(text: string, h: number): number {
  let w = 0;
  for (const ch of text) w += ch === " " ? h * 0.4 : h * 0.72;
  return w - h * 0.22;
}
