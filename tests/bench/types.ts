/**
 * The contract between the bench harness (run.ts) and each bench module (`tests/bench/<name>.bench.ts`).
 *
 * The machine is shared and noisy, so a figure is only meaningful against a baseline measured in the same run:
 * give every figure a `baseline` where one exists, and the harness prints the ratio value / baseline.
 */

export interface BenchDatabase {
  /** mysql://… URL of a fresh, empty database with its own application user (never root). */
  url: string;
  name: string;
  /** Drops the database. The harness also drops every database left over when the run ends. */
  drop: () => void;
}

export interface BenchEnv {
  /** A fresh, empty database on the run's throwaway MariaDB. */
  createDatabase: () => BenchDatabase;
  /** Progress lines, prefixed with the bench's name. */
  log: (line: string) => void;
}

export interface BenchResult {
  /** What was measured, e.g. "list page p95". */
  figure: string;
  /** e.g. "ms", "req/s", "MB". */
  unit: string;
  /** The measured value. */
  value: number;
  /** The same thing measured in the same run by the reference path; the harness prints value / baseline. */
  baseline?: number;
  /** What the baseline is, e.g. "bare mysql2". */
  baselineLabel?: string;
  /**
   * True for figures where more is better (requests/s, a score): the ratio is then baseline / value, so that in
   * every row a ratio above 1 means ours is worse than the baseline by that factor.
   */
  higherIsBetter?: boolean;
  /** Set when the figure itself is a failure (errors, non-2xx …): the report marks the row and the run exits 1. */
  failed?: string;
  /** How many samples the figure (and its baseline) came from. */
  samples: number;
}

export interface BenchModule {
  /** Short and unique; `npm run bench -- <word>` runs the benches whose name contains <word>. */
  name: string;
  run: (env: BenchEnv) => Promise<BenchResult[]>;
}
