// The full-resolution traces of a record's proof tests as one CSV. Traces are never stored: each
// test is re-run from its stored drill, controller and seed (the engine is deterministic), and
// its fingerprint must equal the one stored when the record was written — otherwise the engine
// has changed since, and serving the new trace under the old record would be false evidence.
import type { RecordDetail } from "./record-queries";
import { rerunProofTest } from "./proof-run";
import { traceFingerprint } from "@/sim/drill/trace-hash";

export class TraceMismatch extends Error {}

const COLUMNS = "test,t_s,sp_c,pv_c,pv_filtered_c,true_c,out_pct";

/** CSV comment lines never contain a line break or start a formula in a spreadsheet. */
const comment = (s: string) => `# ${s.replace(/[\r\n]+/g, " ")}`;

export function recordTracesCsv(detail: Pick<RecordDetail, "title" | "id" | "document">): string {
  const doc = detail.document;
  const head = [comment(`Loopwright tuning record ${detail.id}: ${detail.title}`), comment(`engine ${doc.engineVersion}; units: s, °C, %`)];
  const body: string[] = [];
  doc.proofTests.forEach((t, i) => {
    const trace = rerunProofTest(t).trace;
    const fp = traceFingerprint(trace);
    if (fp !== t.traceFingerprint) {
      throw new TraceMismatch(`Proof test ${i + 1} ("${t.label}") re-runs to fingerprint ${fp}, which does not match the stored ${t.traceFingerprint}: the engine has changed since the record was written.`);
    }
    head.push(comment(`test ${i + 1}: ${t.label} (${t.tuningLabel}, seed ${t.seed}): fingerprint ${t.traceFingerprint} matches the record`));
    for (let k = 0; k < trace.length; k++) {
      body.push(`${i + 1},${trace.timeS[k]},${trace.setpointC[k]},${trace.pvRawC[k]},${trace.pvFilteredC[k]},${trace.trueC[k]},${trace.outPercent[k]}`);
    }
  });
  return [...head, COLUMNS, ...body].join("\n") + "\n";
}
