// `npm test`: type checks, lint, the client build, then every vitest suite (unit, API, end-to-end), ending with the
// plain "N passed, N failed" line that CI reads.
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, existsSync, rmSync } from "node:fs";

const env = { ...process.env, NO_COLOR: "1", FORCE_COLOR: "0" };
const run = (cmd, args) => spawnSync(cmd, args, { stdio: "inherit", env }).status === 0;
let passed = 0;
let failed = 0;
/** A step that is not a test runner counts as one passed or one failed test. */
const step = (title, cmd, args) => {
  console.log(`== ${title}`);
  if (run(cmd, args)) passed++;
  else failed++;
};

step("Type check (tsc --noEmit)", "node_modules/.bin/tsc", ["--noEmit"]);
step("Lint (eslint)", "npm", ["run", "--silent", "lint"]);
step("Client build (vite build)", "node_modules/.bin/vite", ["build", "--logLevel", "warn"]);

mkdirSync("test-results", { recursive: true });
const report = "test-results/vitest.json";
if (existsSync(report)) rmSync(report);
console.log("== Tests (vitest)");
const extra = process.argv.slice(2);
run("node_modules/.bin/vitest", ["run", "--reporter=default", "--reporter=json", `--outputFile=${report}`, ...extra]);
if (existsSync(report)) {
  const r = JSON.parse(readFileSync(report, "utf8"));
  passed += r.numPassedTests;
  failed += r.numFailedTests;
  // A file that failed before any test ran (an import error, a failing beforeAll) counts once.
  for (const file of r.testResults ?? []) {
    if (file.status === "failed" && !(file.assertionResults ?? []).some((a) => a.status === "failed")) failed++;
  }
} else {
  failed++;
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed ? 1 : 0);
