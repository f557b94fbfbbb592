// `sim replay FILE`: re-runs a replay file (drill, controller, seed, action log) with the engine
// and prints the trace fingerprint, whether it matches the file's, and the results.
import { readFileSync } from "node:fs";
import { replayBundleSchema } from "../../drill/replay-bundle";
import { runDrill } from "../../drill/run-drill";
import { traceFingerprint } from "../../drill/trace-hash";
import { ENGINE_VERSION } from "../../version";

export async function runReplayCommand(argv: string[]): Promise<number> {
  const file = argv[0];
  if (!file) {
    console.error("usage: sim replay FILE.json   (a replay file exported from the Bench)");
    return 2;
  }
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(file, "utf8"));
  } catch (err) {
    console.error(`cannot read ${file}: ${err instanceof Error ? err.message : err}`);
    return 2;
  }
  const parsed = replayBundleSchema.safeParse(json);
  if (!parsed.success) {
    for (const i of parsed.error.issues) console.error(`${i.path.join(".") || "(file)"}: ${i.message}`);
    return 2;
  }
  const b = parsed.data;
  const run = runDrill(b.drill, b.controller, b.actions, b.seed);
  const fingerprint = traceFingerprint(run.trace, Math.min(b.rows, run.trace.length));
  const out = {
    engineVersion: ENGINE_VERSION,
    fileEngineVersion: b.engineVersion,
    rows: Math.min(b.rows, run.trace.length),
    fingerprint,
    matches: b.fingerprint === undefined ? null : b.fingerprint === fingerprint,
    results: run.results,
  };
  console.log(JSON.stringify(out, null, 2));
  return out.matches === false ? 1 : 0;
}
