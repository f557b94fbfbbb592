/**
 * Live results on the Bench: one window per setpoint change (from the change to the next one or
 * to now) and one per disturbance flag (from the event for the following 30 min or until the
 * next event), measured on the true temperature with the engine's own results code.
 */
import { computeWindowResults, type WindowResults } from "@/sim/results/window";
import type { SimEvent } from "@/sim/drill/simulation";
import type { Trace } from "@/sim/drill/trace";

export interface BenchWindow {
  label: string;
  results: WindowResults;
}

const DISTURBANCE_SPAN_S = 1800;

export function benchWindows(trace: Trace, events: SimEvent[], noiseSigmaC: number, cutoutPointC: number, bandFloorC = 0.5): BenchWindow[] {
  const n = trace.length;
  if (n < 3) return [];
  const endS = trace.timeS[n - 1];
  const marks: { timeS: number; label: string; kind: "setpoint" | "disturbance" }[] = [];
  for (let i = 1; i < n; i++) {
    if (trace.setpointC[i] !== trace.setpointC[i - 1]) marks.push({ timeS: trace.timeS[i], label: `SP ${trace.setpointC[i - 1].toFixed(1)} → ${trace.setpointC[i].toFixed(1)} °C`, kind: "setpoint" });
  }
  for (const e of events) {
    if (e.type === "action" && e.detail.startsWith("disturbance")) marks.push({ timeS: e.timeS, label: e.detail.replace(/^disturbance /, ""), kind: "disturbance" });
  }
  marks.sort((a, b) => a.timeS - b.timeS);
  return marks.slice(-8).map((m, idx, all) => {
    const next = all.slice(idx + 1).find((o) => o.timeS > m.timeS);
    // a window ends just before the next change (its sample belongs to the next window)
    const ts = n > 1 ? trace.timeS[1] - trace.timeS[0] : 1;
    const windowEndS = Math.min(endS, next ? next.timeS - ts / 2 : Infinity, m.kind === "disturbance" ? m.timeS + DISTURBANCE_SPAN_S : Infinity);
    const results = computeWindowResults({
      t: trace.timeS,
      y: trace.trueC,
      sp: trace.setpointC,
      out: trace.outPercent,
      heaterPowerW: trace.heaterPowerW,
      windowStartS: m.timeS,
      windowEndS: Math.max(windowEndS, m.timeS),
      kind: m.kind,
      eventTimeS: m.timeS,
      bandFloorC,
      noiseSigmaC,
      cutoutPointC,
    });
    return { label: m.label, results };
  });
}
