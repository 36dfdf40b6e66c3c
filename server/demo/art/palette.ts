/**
 * Colours for the demo photo illustrations: plain colour words from the demo stock ("White", "Slate grey", "Deep red"…)
 * mapped to paint hex values, small colour arithmetic for shading, and a seeded random source so every picture is
 * reproducible.
 */

const NAMED: Record<string, string> = {
  white: "#eef0f1",
  black: "#1d1f23",
  grey: "#7c8288",
  gray: "#7c8288",
  silver: "#b9bec3",
  red: "#b3202a",
  maroon: "#6b1d24",
  burgundy: "#6b1d2e",
  blue: "#2a5ea8",
  navy: "#1f2f55",
  green: "#2f6b45",
  yellow: "#e8b923",
  orange: "#e0711f",
  sand: "#c9b48a",
  beige: "#cdbb98",
  bronze: "#8c6239",
  brown: "#6a4a33",
  gold: "#b99448",
  copper: "#a0573a",
  purple: "#5b3a7a",
  teal: "#24777a",
  charcoal: "#3b3f44",
  graphite: "#4a4e54",
  gunmetal: "#53585e",
  slate: "#5d6773",
  pearl: "#f2efe8",
  cream: "#ece2c8",
  champagne: "#d8c7a1",
  olive: "#5f6a3a",
  khaki: "#a39a6a",
};

/** Modifiers move the lightness of the base colour ("Dark blue", "Pale green", "Deep red"). */
const MODIFIERS: Record<string, number> = {
  dark: -0.35, deep: -0.25, midnight: -0.5, light: 0.3, pale: 0.45, bright: 0.12, metallic: 0.05, pearl: 0.08,
};

const NEUTRAL = "#8e9296";

/** Maps a plain colour description to a paint hex (#rrggbb). Unknown words give a neutral grey. Deterministic. */
export function colourToHex(colour: string): string {
  const words = colour.toLowerCase().replace(/[^a-z ]/g, " ").split(/\s+/).filter(Boolean);
  const joined = words.join(" ");
  if (joined === "slate grey" || joined === "slate gray") return "#5d6773";
  // The last recognised colour word is the base ("slate grey" → grey tinted by slate is handled above).
  let base: string | undefined;
  let shift = 0;
  for (const w of words) {
    if (NAMED[w] && !(w === "pearl" && words.length > 1)) base = NAMED[w];
    if (MODIFIERS[w] !== undefined && !(w === "pearl" && words.length === 1)) shift += MODIFIERS[w];
  }
  if (!base) return NEUTRAL;
  return shift >= 0 ? mix(base, "#ffffff", Math.min(shift, 0.8)) : mix(base, "#000000", Math.min(-shift, 0.8));
}

export function hexToRgb(hex: string): [number, number, number] {
  const h = hex.replace("#", "");
  return [parseInt(h.slice(0, 2), 16), parseInt(h.slice(2, 4), 16), parseInt(h.slice(4, 6), 16)];
}

function toHex(rgb: [number, number, number]): string {
  return "#" + rgb.map((v) => Math.round(Math.max(0, Math.min(255, v))).toString(16).padStart(2, "0")).join("");
}

/** Linear mix of two hex colours; t = 0 gives a, t = 1 gives b. */
export function mix(a: string, b: string, t: number): string {
  const x = hexToRgb(a);
  const y = hexToRgb(b);
  return toHex([x[0] + (y[0] - x[0]) * t, x[1] + (y[1] - x[1]) * t, x[2] + (y[2] - x[2]) * t]);
}

/** Lightens (amount > 0) or darkens (amount < 0) a colour. */
export function shade(hex: string, amount: number): string {
  return amount >= 0 ? mix(hex, "#ffffff", amount) : mix(hex, "#000000", -amount);
}

/** Relative luminance 0..1, used to keep highlights visible on very light and very dark paint. */
export function luminance(hex: string): number {
  const [r, g, b] = hexToRgb(hex);
  return (0.2126 * r + 0.7152 * g + 0.0722 * b) / 255;
}

/** Small deterministic PRNG (mulberry32). */
export function rng(seed: number): () => number {
  let a = (Math.floor(seed) ^ 0x9e3779b9) >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const TYRE = "#1f2124";
export const TRIM = "#2a2d31";
export const GLASS = "#2c3a48";
