// The rubric of a drill, visible before an attempt (on the assignment page and the attempt Bench):
// the score's formula, the windows and their weights, the metric weights, and the rules of the
// attempt (what may change, relay and bump tests, pace, noise seed). From sim/drill/rubric.ts.
import { drillRubric } from "@/sim/drill/rubric";
import type { Drill } from "@/sim/drill/schema";
import { TableHead } from "@/components/tables/TableHead";
import { formatElapsed } from "@/components/trend/format";
import { speedLabel } from "@/components/attempts/attempt-pace";

const minutes = (s: number) => (s / 60).toFixed(s % 60 === 0 ? 0 : 1);
const pct = (x: number) => `${Math.round(x)} %`;

/** The rubric, visible before the attempt: the formula, the windows, the weights and the rules. */
export function RubricPanel({ drill, speeds = drill.pace.speeds }: { drill: Drill; speeds?: number[] }) {
  const r = drillRubric(drill);
  const yes = (v: boolean) => (v ? "yes" : "no");
  return (
    <section aria-label="How this attempt is scored" data-testid="attempt-rubric" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4 text-xs">
      <h2 className="font-semibold uppercase tracking-wide text-ink-faint">How this attempt is scored</h2>
      <p className="leading-snug text-ink-soft">{r.formula}</p>
      <p className="leading-snug text-ink-soft">
        Measured on the true temperature; the reference is this drill&apos;s reference tuning on the same drill and seed. Each cutout trip multiplies the total by <span className="num">{r.tripPenaltyFactor}</span>.
      </p>
      <table className="w-full border-collapse" data-testid="attempt-rubric-windows">
        <TableHead columns={["window", "kind", "min", "share"]} />
        <tbody>
          {r.windows.map((w) => (
            <tr key={w.id} className="border-b border-rule">
              <td className="py-1 pr-2">{w.label}</td>
              <td className="py-1 pr-2 text-ink-soft">{w.kind}</td>
              <td className="num py-1 pr-2">
                {minutes(w.startS)}–{minutes(w.endS)} min
              </td>
              <td className="num py-1">{pct(w.sharePct)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-0.5">
        <dt className="text-ink-soft">IAE</dt>
        <dd className="num">{pct(r.metricWeightsPct.iae)}</dd>
        <dt className="text-ink-soft">Overshoot / peak deviation</dt>
        <dd className="num">{pct(r.metricWeightsPct.peak)}</dd>
        <dt className="text-ink-soft">Settling / recovery time</dt>
        <dd className="num">{pct(r.metricWeightsPct.time)}</dd>
        <dt className="text-ink-soft">Settling band floor</dt>
        <dd className="num">{r.bandFloorC} °C</dd>
      </dl>
      <div>
        <h3 className="mb-0.5 font-semibold text-ink-soft">What you may change</h3>
        <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-0.5" data-testid="attempt-rubric-rules">
          <dt className="text-ink-soft">Tuning (gains, times, form, weights, anti-windup)</dt>
          <dd>yes</dd>
          <dt className="text-ink-soft">PV filter</dt>
          <dd>{yes(r.mayChange.pvFilter)}</dd>
          <dt className="text-ink-soft">Sample time</dt>
          <dd>{r.mayChange.sampleTime ? "before the run" : "no"}</dd>
          <dt className="text-ink-soft">Operating the loop (SP, auto/manual, OUT)</dt>
          <dd>{yes(r.mayChange.operation)}</dd>
          <dt className="text-ink-soft">Relay test</dt>
          <dd>{yes(r.mayChange.relayTest)}</dd>
          <dt className="text-ink-soft">Bump test</dt>
          <dd>{yes(r.mayChange.bumpTest)}</dd>
        </dl>
      </div>
      <div>
        <h3 className="mb-0.5 font-semibold text-ink-soft">Pace</h3>
        <p className="leading-snug text-ink-soft" data-testid="attempt-rubric-pace">
          Runs <span className="num">{formatElapsed(drill.durationS)}</span> of simulated time at <span className="num">{speeds.map(speedLabel).join(", ")}</span> real time.{" "}
          {r.pace.pauseAllowed ? "You may pause." : "No pause: once started, it runs to the end."} No reset: the attempt counts from its start.{" "}
          {r.seed.policy === "fixed" ? "Every attempt sees the same noise." : "Each attempt draws its own noise."}
        </p>
      </div>
    </section>
  );
}
