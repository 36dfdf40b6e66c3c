/**
 * One Lighthouse run, in its own process so its trace processing never shares an event loop with the app under test.
 * Started by public.bench.ts: `node lighthouse-run.mjs <url> <chrome debugging port> <output .json path>`.
 * Uses the default config (mobile form factor, simulated throttling), performance category only, against a
 * Chromium the parent launched and will stop. Writes the Lighthouse result (LHR) as JSON to the output path.
 */
import { writeFileSync } from "node:fs";
import lighthouse from "lighthouse";

const [url, port, out] = process.argv.slice(2);
if (!url || !port || !out) {
  console.error("usage: node lighthouse-run.mjs <url> <port> <out.json>");
  process.exit(2);
}

const result = await lighthouse(url, { port: Number(port), output: "json", logLevel: "error", onlyCategories: ["performance"] });
if (!result) {
  console.error("lighthouse returned no result");
  process.exit(1);
}
writeFileSync(out, JSON.stringify(result.lhr));
if (result.lhr.runtimeError) {
  console.error(`lighthouse runtime error: ${result.lhr.runtimeError.code} ${result.lhr.runtimeError.message}`);
  process.exit(1);
}
process.exit(0);
