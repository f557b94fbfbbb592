"use client";
/**
 * The tuning map as a heatmap: one cell per Kc × Ti pair, shaded from light (better, lower) to
 * dark (worse, higher) on a log scale, unreached cells hatched, the current tuning outlined.
 * Clicking a cell loads that tuning.
 */
import { useMemo } from "react";
import type { VariantRun } from "@/sim/experiments/variants";
import { mapValue, MAP_METRICS, type MapMetric } from "@/sim/experiments/tuning-map";

export function TuningMap({ rows, kcAxis, tiAxis, metric, current, onPick }: { rows: VariantRun[]; kcAxis: number[]; tiAxis: number[]; metric: MapMetric; current: { kc: number; ti: number }; onPick: (kc: number, ti: number) => void }) {
  const values = useMemo(() => rows.map((r) => mapValue(r.results, metric)), [rows, metric]);
  const finite = values.filter((v): v is number => v != null && v > 0);
  const lo = Math.log(Math.min(...finite, 1e9));
  const hi = Math.log(Math.max(...finite, 1e-9));
  const cell = 18;
  const nearest = (axis: number[], v: number) => axis.reduce((best, x, i) => (Math.abs(Math.log(x / v)) < Math.abs(Math.log(axis[best] / v)) ? i : best), 0);
  const ci = nearest(kcAxis, current.kc);
  const cj = nearest(tiAxis, current.ti);
  const best = finite.length ? values.indexOf(Math.min(...finite)) : -1;
  const { label, unit } = MAP_METRICS[metric];
  return (
    <figure className="space-y-2" data-testid="tuning-map">
      <svg width={kcAxis.length * cell + 60} height={tiAxis.length * cell + 40} role="img" aria-label={`${label} over Kc and Ti`}>
        <g transform="translate(52,4)">
          {tiAxis.map((ti, j) =>
            kcAxis.map((kc, i) => {
              const k = j * kcAxis.length + i;
              const v = values[k];
              const done = k < rows.length;
              const f = v != null && v > 0 && hi > lo ? (Math.log(v) - lo) / (hi - lo) : v != null ? 0 : 1;
              const shade = Math.round(245 - f * 190);
              return (
                <rect
                  key={k}
                  x={i * cell}
                  y={(tiAxis.length - 1 - j) * cell}
                  width={cell - 1}
                  height={cell - 1}
                  fill={!done ? "#eceae4" : v == null ? "url(#lw-hatch)" : `rgb(${shade},${shade + 4 > 255 ? 255 : shade + 4},${Math.min(255, shade + 14)})`}
                  stroke={k === best ? "#2f8f86" : "none"}
                  strokeWidth={2}
                  onClick={() => onPick(kc, ti)}
                  style={{ cursor: "pointer" }}
                >
                  <title>{`Kc ${kc} %/°C, Ti ${ti} s: ${v == null ? (done ? "not reached" : "pending") : `${v.toFixed(1)} ${unit}`}`}</title>
                </rect>
              );
            }),
          )}
          <rect x={ci * cell - 1} y={(tiAxis.length - 1 - cj) * cell - 1} width={cell + 1} height={cell + 1} fill="none" stroke="#1f2326" strokeWidth={2} strokeDasharray="3 2" />
          <text x={-6} y={tiAxis.length * cell / 2} fontSize={10} textAnchor="end" fill="#4b5258" transform={`rotate(-90 -40 ${(tiAxis.length * cell) / 2})`}>
            Ti (s)
          </text>
          <text x={(kcAxis.length * cell) / 2} y={tiAxis.length * cell + 28} fontSize={10} textAnchor="middle" fill="#4b5258">
            Kc (%/°C)
          </text>
          <text x={0} y={tiAxis.length * cell + 12} fontSize={9} fill="#7c848a" className="num">
            {kcAxis[0]}
          </text>
          <text x={kcAxis.length * cell} y={tiAxis.length * cell + 12} fontSize={9} textAnchor="end" fill="#7c848a">
            {kcAxis[kcAxis.length - 1]}
          </text>
          <text x={-4} y={tiAxis.length * cell - 4} fontSize={9} textAnchor="end" fill="#7c848a">
            {tiAxis[0]}
          </text>
          <text x={-4} y={10} fontSize={9} textAnchor="end" fill="#7c848a">
            {tiAxis[tiAxis.length - 1]}
          </text>
        </g>
        <defs>
          <pattern id="lw-hatch" width="4" height="4" patternUnits="userSpaceOnUse">
            <path d="M0 4 L4 0" stroke="#b9b5aa" strokeWidth="1" />
          </pattern>
        </defs>
      </svg>
      <figcaption className="text-xs text-ink-faint">
        {label} ({unit}) on the true temperature, first window; lighter is better, log shading; dashed box: current tuning; teal: best cell; hatched: never settled. Click a cell to load it.
      </figcaption>
    </figure>
  );
}
