/**
 * One Lighthouse run, in its own process so its trace processing never shares an event loop with the app under test.
 * Started by public.bench.ts: `node lighthouse-run.mjs <url> <chrome debugging port> <output .json path>`.
 * Default config (mobile form factor, simulated throttling), performance category only, against a Chromium the
 * parent launched and will stop. Writes the Lighthouse result (LHR) as JSON to the output path and prints one JSON
 * line ({ patchedTraceEvents }) on stdout.
 *
 * One compatibility shim, nothing else changed in the default config: Chromium renamed the `PipelineReporter` trace
 * event's `args.chrome_frame_reporter` to `args.frame_reporter` (Debian's Chromium 156 has the new name), and the
 * trace engine in Lighthouse 12.2.3 reads the old one, so its RootCauses and TraceElements gatherers throw
 * ("Cannot read properties of undefined (reading 'frame_sequence')") and the LCP-element, render-blocking,
 * layout-shift and LCP-image audits come out as errors. The Trace gatherer is swapped for a subclass that copies the
 * new field to the old name after collection. Metrics and scoring are untouched.
 */
import { writeFileSync } from "node:fs";
import lighthouse, { defaultConfig } from "lighthouse";
import Trace from "lighthouse/core/gather/gatherers/trace.js";

const [url, port, out] = process.argv.slice(2);
if (!url || !port || !out) {
  console.error("usage: node lighthouse-run.mjs <url> <port> <out.json>");
  process.exit(2);
}

let patchedTraceEvents = 0;
class CompatibleTrace extends Trace {
  getArtifact(context) {
    const trace = super.getArtifact(context);
    for (const event of trace.traceEvents) {
      const args = event.args;
      if (event.name === "PipelineReporter" && args?.frame_reporter && !args.chrome_frame_reporter) {
        args.chrome_frame_reporter = args.frame_reporter;
        patchedTraceEvents++;
      }
    }
    return trace;
  }
}

const config = {
  ...defaultConfig,
  artifacts: defaultConfig.artifacts.map((a) => (a.id === "Trace" ? { id: "Trace", gatherer: { implementation: CompatibleTrace } } : a)),
};

const result = await lighthouse(url, { port: Number(port), output: "json", logLevel: "error", onlyCategories: ["performance"] }, config);
if (!result) {
  console.error("lighthouse returned no result");
  process.exit(1);
}
writeFileSync(out, JSON.stringify(result.lhr));
console.log(JSON.stringify({ patchedTraceEvents }));
if (result.lhr.runtimeError) {
  console.error(`lighthouse runtime error: ${result.lhr.runtimeError.code} ${result.lhr.runtimeError.message}`);
  process.exit(1);
}
process.exit(0);
