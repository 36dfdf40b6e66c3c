/**
 * `npm run bench [-- word …]`: starts one throwaway MariaDB, runs every `tests/bench/*.bench.ts` in turn (only those
 * whose name contains one of the words, when given), prints a table per bench and writes them all to
 * test-results/bench-report.md. The MariaDB is stopped and its directory removed however the run ends.
 *
 * A bench module exports `name` and `run(env)`; see types.ts.
 */
import { mkdirSync, mkdtempSync, readdirSync, writeFileSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { spawnSync } from "node:child_process";
import { cpus, loadavg, release as osRelease, tmpdir, totalmem, type as osType } from "node:os";
import path from "node:path";
import { freePort } from "../support/ports.ts";
import { fileURLToPath, pathToFileURL } from "node:url";
import {
  databaseUrl, dropDatabase, ensureMariadbInstalled, findBinary, instanceFor, provisionDatabase, removeDataDir, startMariadb, stopMariadb,
  type MariadbInstance,
} from "../../server/db/mariadb.ts";
import type { BenchDatabase, BenchEnv, BenchModule, BenchResult } from "./types.ts";

const BENCH_DIR = path.dirname(fileURLToPath(import.meta.url));
const REPORT = path.resolve("test-results/bench-report.md");
/** The committed copy the README links; only a run of every bench writes it. */
const DOCS_REPORT = path.resolve("docs/benchmarks.md");


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

const num = (n: number) => (!Number.isFinite(n) || Number.isInteger(n) ? String(n) : Math.abs(n) >= 100 ? n.toFixed(0) : Math.abs(n) >= 10 ? n.toFixed(1) : n.toFixed(2));
/** Every ratio reads "times worse than the baseline": value / baseline, or baseline / value where more is better. */
const ratioOf = (r: BenchResult) => (r.baseline ? `${(r.higherIsBetter ? r.baseline / r.value : r.value / r.baseline).toFixed(2)}×` : "—");
const ratioIs = (r: BenchResult) => (r.baseline === undefined ? "" : r.higherIsBetter ? "base ÷ ours" : "ours ÷ base");

function rowsOf(results: BenchResult[]): string[][] {
  return results.map((r) => [
    r.failed ? `FAILED ${r.figure}` : r.figure,
    `${num(r.value)} ${r.unit}`.trim(),
    r.baseline === undefined ? "—" : `${num(r.baseline)} ${r.unit}${r.baselineLabel ? ` (${r.baselineLabel})` : ""}`.replace(/ +\(/, " ("),
    ratioOf(r),
    ratioIs(r),
    String(r.samples),
  ]);
}

const HEAD = ["figure", "ours", "baseline", "ratio", "ratio is", "samples"];

function textTable(rows: string[][]): string {
  const widths = HEAD.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join("  ");
  return [line(HEAD), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

interface Outcome {
  name: string;
  results: BenchResult[];
  error?: string;
  seconds: number;
}

/** Cores, CPU model, memory, node and MariaDB: what a reader needs to compare two reports. */
function machine(): string[] {
  const mariadbd = findBinary("mariadbd");
  const mariadb = mariadbd ? (spawnSync(mariadbd, ["--version"], { encoding: "utf8" }).stdout ?? "").match(/Ver\s+(\S+)/)?.[1] ?? "unknown" : "not found";
  const cpu = cpus();
  return [
    `- date: ${new Date().toISOString()}`,
    `- machine: ${cpu.length} cores (${cpu[0]?.model.trim() ?? "unknown CPU"}), ${(totalmem() / 2 ** 30).toFixed(1)} GiB memory, ${osType()} ${osRelease()}; load average at the end ${loadavg().map((l) => l.toFixed(2)).join(" ")}`,
    `- node ${process.version}, MariaDB ${mariadb}`,
  ];
}

const esc = (s: string) => s.replace(/\|/g, "\\|").replace(/\n/g, " ");

function markdown(outcomes: Outcome[], words: string[]): string {
  const failed = outcomes.filter((o) => o.error || o.results.some((r) => r.failed));
  const out = [
    "# Benchmarks",
    "",
    `Written by \`npm run bench${words.length ? ` -- ${words.join(" ")}` : ""}\` (tests/bench/run.ts).`,
    "",
    ...machine(),
    `- benches: ${outcomes.map((o) => `${o.name} (${o.seconds.toFixed(0)} s)`).join(", ")}; ${failed.length ? `**${failed.length} with failures: ${failed.map((o) => o.name).join(", ")}**` : "no failures"}`,
    "",
    "## How to read it",
    "",
    "- Every figure is measured against a baseline taken **in the same run** on the same machine (a plain node:http",
    "  server answering the same bytes, bare mysql2 or bare sharp doing the same work, or a stated aim). The machine is",
    "  shared and small, so absolute numbers move from run to run; the ratios are what to compare between reports.",
    "- **ratio** is always \"times worse than the baseline\": ours ÷ baseline for times, sizes and memory, baseline ÷ ours",
    "  for requests/s and scores (the *ratio is* column says which). 1.00× is as good as the baseline; 3.00× means three",
    "  times slower, bigger or fewer; below 1 means better than the baseline (usual against an aim).",
    "- A row starting **FAILED** is a correctness failure under load (errors, timeouts, non-2xx answers), whatever its",
    "  speed; a bench that failed outright is listed with its error. The run then exits 1.",
    "- Latency percentiles from autocannon are whole milliseconds; a baseline under 1 ms is shown as 1 ms, and the ratio is",
    "  then a lower bound.",
    "- What each bench does, its data and its knobs (environment variables) are described at the top of",
    "  `tests/bench/<name>.bench.ts`; the console output of a run has the diagnostic lines (CPU per process, bytes per",
    "  response, the costliest Lighthouse audits) behind each figure.",
    "",
  ];
  for (const o of outcomes) {
    out.push(`## ${o.name}`, "", `${o.results.length} figures in ${o.seconds.toFixed(0)} s.`, "");
    if (o.results.length) {
      out.push(`| ${HEAD.join(" | ")} |`, "|---|---:|---:|---:|---|---:|");
      for (const [i, row] of rowsOf(o.results).entries()) {
        const r = o.results[i];
        const cells = row.map(esc);
        if (r.failed) cells[0] = `**FAILED** ${esc(r.figure)}: ${esc(r.failed)}`;
        out.push(`| ${cells.join(" | ")} |`);
      }
      out.push("");
    }
    if (o.error) out.push(`**failed**: ${esc(o.error)}`, "");
  }
  return out.join("\n");
}

async function main(): Promise<number> {
  const words = process.argv.slice(2);
  const benches = await loadBenches(words);
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

  const outcomes: Outcome[] = [];
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

  const report = markdown(outcomes, words);
  mkdirSync(path.dirname(REPORT), { recursive: true });
  writeFileSync(REPORT, report);
  console.log(`\nwrote ${path.relative(process.cwd(), REPORT)}`);
  // Every bench ran (a run cut short by a signal or a leaked rejection exits before this).
  if (!words.length && outcomes.length === benches.length) {
    mkdirSync(path.dirname(DOCS_REPORT), { recursive: true });
    writeFileSync(DOCS_REPORT, report);
    console.log(`wrote ${path.relative(process.cwd(), DOCS_REPORT)} (a full run)`);
  }
  const failures = outcomes.flatMap((o) => [...(o.error ? [`${o.name}: ${o.error}`] : []), ...o.results.filter((r) => r.failed).map((r) => `${o.name}: ${r.figure}: ${r.failed}`)]);
  for (const f of failures) console.error(`FAILED ${f}`);
  return failures.length ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);
