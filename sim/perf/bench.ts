/**
 * `npm run perf`: speed of the engine on a 2-hour reference drill (0.1 s sample time, 2 s cycle
 * time, noise on), as simulated seconds per wall second (median of several runs, one core):
 *   - exact:  the default path (modal exact steps between switching instants);
 *   - rk4:    a straightforward fixed-step RK4 of the same model in the same process, its steps
 *             landing on every switching instant and event, at the largest step whose trace
 *             matches the exact one within 0.001 °C (accuracy-matched);
 *   - nonlinear: the nonlinear-loss mode integrated with odex (tolerance 1e-8).
 * The last line is `realtime-factor <number>` for the default mode. Not a test: nothing asserts
 * on time.
 */
import { runDrill, type Drill } from "../drill";
import { referenceDrill } from "./reference-drill";
import type { IntegratorKind } from "../plant/enclosure-plant";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

function timeRuns(drill: Drill, runs: number, integrator: IntegratorKind, extra: { rk4MaxStepS?: number; odexTolerance?: number } = {}) {
  const ms: number[] = [];
  let last;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    last = runDrill(drill, null, [], undefined, { integrator, ...extra });
    ms.push(performance.now() - t0);
  }
  const med = median(ms);
  return { medianMs: med, factor: drill.durationS / (med / 1000), run: last! };
}

function maxDiff(a: Float64Array, b: Float64Array): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

function main(): void {
  const drill = referenceDrill();
  // warm-up (JIT)
  for (let i = 0; i < 3; i++) runDrill(drill);
  const exact = timeRuns(drill, 9, "exact");
  console.log(`exact      : median ${exact.medianMs.toFixed(1)} ms over 9 runs of a ${drill.durationS} s drill → ${Math.round(exact.factor)} simulated s per wall s`);

  let chosen = { step: 0, err: Infinity };
  for (const step of [0.1, 0.05, 0.025, 0.0125]) {
    const r = runDrill(drill, null, [], undefined, { integrator: "rk4", rk4MaxStepS: step });
    const err = maxDiff(r.trace.trueC, exact.run.trace.trueC);
    if (err <= 1e-3) {
      chosen = { step, err };
      break;
    }
  }
  if (chosen.step > 0) {
    runDrill(drill, null, [], undefined, { integrator: "rk4", rk4MaxStepS: chosen.step });
    const rk4 = timeRuns(drill, 5, "rk4", { rk4MaxStepS: chosen.step });
    console.log(
      `rk4        : step ≤ ${chosen.step} s (max |ΔT| vs exact ${chosen.err.toExponential(2)} °C), median ${rk4.medianMs.toFixed(1)} ms over 5 runs → ${Math.round(rk4.factor)} simulated s per wall s`,
    );
  } else console.log("rk4        : no tested step matched the exact trace within 0.001 °C");

  const nl = referenceDrill("nonlinear");
  const nonlinear = timeRuns(nl, 3, "odex", { odexTolerance: 1e-8 });
  console.log(`nonlinear  : odex (tol 1e-8), median ${nonlinear.medianMs.toFixed(0)} ms over 3 runs → ${Math.round(nonlinear.factor)} simulated s per wall s`);
  console.log(`realtime-factor ${Math.round(exact.factor)}`);
}

main();
