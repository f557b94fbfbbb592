"use client";
/**
 * Power curve of the Bench's plant (sim/tuning/power-curve.ts, computed in the engine worker:
 * analytic for a linear plant, simulated to steady state for the nonlinear-loss mode): the
 * steady-state temperature against OUT, the OUT that holds the present SP and heat-up estimates.
 */
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { traceColors } from "@/tailwind.config";
import { temperatureDeltaToDisplay, temperatureToDisplay } from "@/sim/units";
import { Duration, Qty } from "../plants/format";
import { useBench, type DisplayUnits } from "../store";

export interface PowerCurvePanelProps {
  units: DisplayUnits;
  onRequest: (setpointC: number) => void;
}

export function PowerCurvePanel({ units, onRequest }: PowerCurvePanelProps) {
  // SP changes rarely; round so a tracked SP (following PV in manual) does not ask every chunk
  const sp = useBench((s) => (s.snapshot ? Math.round(s.snapshot.setpointC * 10) / 10 : null));
  const pc = useBench((s) => s.powerCurve);
  const request = useRef(onRequest);
  request.current = onRequest;
  // ask again after a new load (the store drops the curve) or a new SP
  const stale = pc === null || pc.setpointC !== sp;
  useEffect(() => {
    if (sp === null || !stale) return;
    const id = setTimeout(() => request.current(sp), 250);
    return () => clearTimeout(id);
  }, [sp, stale]);
  const T = `°${units.temperature}`;

  return (
    <section aria-label="Power curve" className="space-y-2 text-xs" data-testid="power-curve">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Power curve</h3>
      {!pc ? (
        <p className="text-ink-faint">Computing the plant&apos;s steady states…</p>
      ) : (
        <>
          <PowerCurveChart points={pc.curve.points} setpointC={pc.setpointC} holdingOut={pc.holding.ok ? pc.holding.outPercent : null} unit={units.temperature} />
          <p className="text-ink-faint" data-testid="power-curve-method">
            {pc.curve.method === "analytic" ? "Analytic: the plant is linear, so each point is its steady-state heat balance (no simulation needed)." : `Simulated: the plant's losses are nonlinear, so each point was run to steady state (${pc.curve.note.replace(/^simulated to steady state \(nonlinear losses\), /, "")}).`}
          </p>
          <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
            <dt className="text-ink-soft">OUT that holds SP {temperatureToDisplay(pc.setpointC, units.temperature).toFixed(1)} {T}</dt>
            <dd data-testid="power-curve-holding">{pc.holding.ok ? <Qty value={pc.holding.outPercent} unit="%" digits={1} /> : "—"}</dd>
            {pc.staticGainCPerPercent !== null ? (
              <>
                <dt className="text-ink-soft">Static gain there</dt>
                <dd>
                  <Qty value={temperatureDeltaToDisplay(pc.staticGainCPerPercent, units.temperature)} unit={`${T}/%`} />
                </dd>
              </>
            ) : null}
            <dt className="text-ink-soft">Heat-up from ambient, OUT 100 %</dt>
            <dd>{pc.heatUp.atFullOutputS === null ? "never reaches SP" : <Duration seconds={pc.heatUp.atFullOutputS} />}</dd>
            <dt className="text-ink-soft">…at the holding OUT, to 95 %</dt>
            <dd>{pc.heatUp.atHoldingOutputS === null ? "—" : <Duration seconds={pc.heatUp.atHoldingOutputS} />}</dd>
          </dl>
          {!pc.holding.ok ? <p className="text-caution">{pc.holding.reason}</p> : null}
        </>
      )}
    </section>
  );
}

function PowerCurveChart({ points, setpointC, holdingOut, unit }: { points: { outPercent: number; steadyStateC: number }[]; setpointC: number; holdingOut: number | null; unit: "C" | "F" }) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!host.current || points.length < 2) return;
    const xs = [...new Set([...points.map((p) => p.outPercent), ...(holdingOut === null ? [] : [holdingOut])])].sort((a, b) => a - b);
    const at = new Map(points.map((p) => [p.outPercent, temperatureToDisplay(p.steadyStateC, unit)]));
    const curve = xs.map((x) => at.get(x) ?? null);
    const mark = xs.map((x) => (x === holdingOut ? temperatureToDisplay(setpointC, unit) : null));
    const spLine = xs.map(() => temperatureToDisplay(setpointC, unit));
    const T = `°${unit}`;
    const u = new uPlot(
      {
        width: host.current.clientWidth || 290,
        height: 170,
        scales: { x: { time: false, range: [0, 100] } },
        axes: [
          { font: "10px var(--font-plex-mono)", grid: { stroke: "#e3e0d8" }, values: (_u, v) => v.map((x) => `${x} %`) },
          { font: "10px var(--font-plex-mono)", grid: { stroke: "#e3e0d8" }, size: 40, space: 20, label: T, labelSize: 14, labelFont: "10px var(--font-plex-sans)" },
        ],
        series: [
          { label: "OUT", value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} %`) },
          { label: "steady state", stroke: traceColors.truth, width: 1.4, spanGaps: true, points: { show: true, size: 4 }, value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} ${T}`) },
          { label: "SP", stroke: traceColors.sp, width: 1, dash: [5, 3], points: { show: false }, value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} ${T}`) },
          { label: "holds SP", stroke: traceColors.out, width: 0, points: { show: true, size: 7, fill: traceColors.out }, value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} ${T}`) },
        ],
        legend: { live: false },
      },
      [xs, curve, spLine, mark] as uPlot.AlignedData,
      host.current,
    );
    return () => u.destroy();
  }, [points, setpointC, holdingOut, unit]);
  return <div ref={host} className="lw-trend" data-testid="power-curve-chart" />;
}
