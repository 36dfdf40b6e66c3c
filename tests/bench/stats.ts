/** Small helpers shared by bench modules. */

/** Nearest-rank percentile (p in 0..100) of the samples; NaN for none. */
export function percentile(samples: readonly number[], p: number): number {
  if (!samples.length) return Number.NaN;
  const sorted = [...samples].sort((a, b) => a - b);
  const rank = Math.min(sorted.length, Math.max(1, Math.ceil((p / 100) * sorted.length)));
  return sorted[rank - 1];
}

export type Rng = () => number;

export const intBetween = (rng: Rng, min: number, max: number) => min + Math.floor(rng() * (max - min + 1));
export const pickOne = <T>(rng: Rng, items: readonly T[]): T => items[Math.floor(rng() * items.length)];

/** Picks from [value, weight] pairs. */
export function pickWeighted<T>(rng: Rng, pairs: ReadonlyArray<readonly [T, number]>): T {
  const total = pairs.reduce((s, [, w]) => s + w, 0);
  let r = rng() * total;
  for (const [value, weight] of pairs) {
    r -= weight;
    if (r < 0) return value;
  }
  return pairs[pairs.length - 1][0];
}

/** A standard normal draw (Box–Muller). */
export function gaussian(rng: Rng): number {
  const u = 1 - rng();
  const v = rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}
