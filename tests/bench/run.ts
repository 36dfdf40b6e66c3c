/**
 * `npm run bench [-- word …]`: starts one throwaway MariaDB, runs every `tests/bench/*.bench.ts` in turn (only those
 * whose name contains one of the words, when given), prints a table per bench and writes them all to
 * test-results/bench-report.md. The MariaDB is stopped and its directory removed however the run ends.
 *
 * A bench module exports `name` and `run(env)`; see types.ts.
 */
import { mkdirSync, mkdtempSync, readdirSync, writeFileSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { cpus, tmpdir } from "node:os";
import path from "node:path";
import { freePort } from "../support/ports.ts";
import { fileURLToPath, pathToFileURL } from "node:url";
import {
  databaseUrl, dropDatabase, ensureMariadbInstalled, instanceFor, provisionDatabase, removeDataDir, startMariadb, stopMariadb,
  type MariadbInstance,
} from "../../server/db/mariadb.ts";
import type { BenchDatabase, BenchEnv, BenchModule, BenchResult } from "./types.ts";

const BENCH_DIR = path.dirname(fileURLToPath(import.meta.url));
const REPORT = path.resolve("test-results/bench-report.md");


async function loadBenches(words: string[]): Promise<BenchModule[]> {
  const files = readdirSync(BENCH_DIR).filter((f) => f.endsWith(".bench.ts")).sort();
  const all: BenchModule[] = [];
  for (const file of files) {
    const mod = (await import(pathToFileURL(path.join(BENCH_DIR, file)).href)) as Partial<BenchModule>;
    if (typeof mod.name !== "string" || typeof mod.run !== "function") throw new Error(`${file} must export name and run(env)`);
    all.push({ name: mod.name, run: mod.run });
  }
  const wanted = words.map((w) => w.toLowerCase());
  const chosen = wanted.length ? all.filter((b) => wanted.some((w) => b.name.toLowerCase().includes(w))) : all;
  if (!chosen.length) throw new Error(`no bench matches ${words.join(" ")}; there are: ${all.map((b) => b.name).join(", ") || "none"}`);
  return chosen;
}

const num = (n: number) => (!Number.isFinite(n) ? String(n) : Math.abs(n) >= 100 ? n.toFixed(0) : Math.abs(n) >= 10 ? n.toFixed(1) : n.toFixed(2));
const ratioOf = (r: BenchResult) => (r.baseline ? `${(r.value / r.baseline).toFixed(2)}×` : "—");

function rowsOf(results: BenchResult[]): string[][] {
  return results.map((r) => [
    r.figure,
    `${num(r.value)} ${r.unit}`,
    r.baseline === undefined ? "—" : `${num(r.baseline)} ${r.unit}${r.baselineLabel ? ` (${r.baselineLabel})` : ""}`,
    ratioOf(r),
    String(r.samples),
  ]);
}

const HEAD = ["figure", "value", "baseline", "ratio", "samples"];

function textTable(rows: string[][]): string {
  const widths = HEAD.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join("  ");
  return [line(HEAD), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

function markdown(outcomes: Array<{ name: string; results: BenchResult[]; error?: string; seconds: number }>): string {
  const out = [
    "# Bench report",
    "",
    `${new Date().toISOString()} · node ${process.version} · ${cpus().length} cores. Ratios are value / baseline, both measured in this run.`,
    "",
    "| bench | figure | value | baseline | ratio | samples |",
    "|---|---|---:|---:|---:|---:|",
  ];
  for (const o of outcomes) {
    for (const row of rowsOf(o.results)) out.push(`| ${o.name} | ${row.join(" | ")} |`);
    if (o.error) out.push(`| ${o.name} | **failed**: ${o.error.replace(/\|/g, "\\|").replace(/\n/g, " ")} | | | | |`);
  }
  return out.join("\n") + "\n";
}

async function main(): Promise<number> {
  const benches = await loadBenches(process.argv.slice(2));
  ensureMariadbInstalled();
  const instance: MariadbInstance = instanceFor(mkdtempSync(path.join(tmpdir(), "forthright-bench-db-")), await freePort());
  const created = new Set<string>();

  // One shared promise, so a signal and the normal path both wait for the same stop-and-remove.
  let stopping: Promise<void> | undefined;
  const cleanup = () =>
    (stopping ??= (async () => {
      await stopMariadb(instance).catch(() => false);
      removeDataDir(instance);
    })());
  const drop = (database: string) => {
    try {
      dropDatabase(instance, database);
    } catch (err) {
      if (!stopping) throw err; // the server is already going away
    }
    created.delete(database);
  };
  const onSignal = (signal: NodeJS.Signals) => {
    console.error(`\n${signal}: stopping MariaDB…`);
    void cleanup().finally(() => process.exit(130));
  };
  process.once("SIGINT", onSignal);
  process.once("SIGTERM", onSignal);
  // A bench that leaks a rejected promise must not leave the server behind either.
  process.once("unhandledRejection", (err) => {
    console.error("unhandled rejection:", err);
    void cleanup().finally(() => process.exit(1));
  });

  const outcomes: Array<{ name: string; results: BenchResult[]; error?: string; seconds: number }> = [];
  try {
    await startMariadb(instance);
    console.log(`MariaDB on 127.0.0.1:${instance.port} (${instance.dataDir})`);
    const createDatabase = (): BenchDatabase => {
      const credentials = { database: `b_${randomBytes(6).toString("hex")}`, user: "forthright_bench", password: "bench-password-not-secret" };
      provisionDatabase(instance, credentials);
      created.add(credentials.database);
      return {
        url: databaseUrl(instance, credentials),
        name: credentials.database,
        drop: () => drop(credentials.database),
      };
    };

    for (const bench of benches) {
      console.log(`\n== ${bench.name}`);
      const env: BenchEnv = { createDatabase, log: (line) => console.log(`  [${bench.name}] ${line}`) };
      const started = performance.now();
      try {
        const results = await bench.run(env);
        const seconds = (performance.now() - started) / 1000;
        outcomes.push({ name: bench.name, results, seconds });
        console.log(`\n${textTable(rowsOf(results))}\n(${seconds.toFixed(1)} s)`);
      } catch (err) {
        const error = err instanceof Error ? (err.stack ?? err.message) : String(err);
        outcomes.push({ name: bench.name, results: [], error: err instanceof Error ? err.message : String(err), seconds: (performance.now() - started) / 1000 });
        console.error(`bench ${bench.name} failed:\n${error}`);
      }
      for (const name of [...created]) drop(name);
      if (stopping) break;
    }
  } finally {
    await cleanup();
  }

  mkdirSync(path.dirname(REPORT), { recursive: true });
  writeFileSync(REPORT, markdown(outcomes));
  console.log(`\nwrote ${path.relative(process.cwd(), REPORT)}`);
  return outcomes.some((o) => o.error) ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);
