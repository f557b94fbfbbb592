import { traceColors } from "@/tailwind.config";
import type { TrendRow } from "@/app/_lib/records/trend-decimation";
import { num } from "@/app/_lib/records/record-figures";
import { trendScale } from "@/app/_lib/records/trend-scale";

/**
 * A proof test's stored trend as a light SVG (server-rendered, prints as vectors): SP dashed
 * graphite and PV steel blue on the temperature axis, OUT ember orange on its own 0–100 % axis.
 */
export function TrendSvg({ rows, title }: { rows: TrendRow[]; title: string }) {
  if (rows.length < 2) return <p className="text-sm text-ink-faint">No trend stored.</p>;
  const W = 720;
  const H = 220;
  const L = 66; // room for a label such as "156.9 °C"
  const R = 40;
  const T = 8;
  const B = 22;
  const scale = trendScale(rows);
  const { t0, t1, lo, hi } = scale;
  const x = (s: number) => L + scale.xFraction(s) * (W - L - R);
  const yT = (c: number) => T + (1 - scale.tempFraction(c)) * (H - T - B);
  const yO = (p: number) => T + (1 - scale.outFraction(p)) * (H - T - B);
  const path = (col: 1 | 2 | 3, y: (v: number) => number) => rows.map((r, i) => `${i ? "L" : "M"}${x(r[0]).toFixed(1)} ${y(r[col]).toFixed(1)}`).join("");
  return (
    <figure className="space-y-1">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full max-w-3xl" role="img" aria-label={`Trend of ${title}: SP, PV and OUT over ${num(t1 / 60, 4)} min`}>
        <rect x={L} y={T} width={W - L - R} height={H - T - B} fill="none" stroke="#d8d5cc" strokeWidth={0.75} />
        <path d={path(3, yO)} fill="none" stroke={traceColors.out} strokeWidth={1} />
        <path d={path(1, yT)} fill="none" stroke={traceColors.sp} strokeWidth={1.2} strokeDasharray="5 3" />
        <path d={path(2, yT)} fill="none" stroke={traceColors.pv} strokeWidth={1.2} />
        <g className="num" fontSize={10} fill="#4b5258">
          <text x={L - 4} y={T + 8} textAnchor="end">{`${num(hi, 4)} °C`}</text>
          <text x={L - 4} y={H - B} textAnchor="end">{`${num(lo, 4)} °C`}</text>
          <text x={W - R + 4} y={T + 8}>100 %</text>
          <text x={W - R + 4} y={H - B}>0 %</text>
          <text x={L} y={H - 6}>{`${num(t0 / 60, 4)} min`}</text>
          <text x={W - R} y={H - 6} textAnchor="end">{`${num(t1 / 60, 4)} min`}</text>
        </g>
      </svg>
      <figcaption className="flex gap-4 text-xs text-ink-soft">
        <span><span aria-hidden className="mr-1 inline-block w-4 border-t-2 border-dashed align-middle" style={{ borderColor: traceColors.sp }} />SP</span>
        <span><span aria-hidden className="mr-1 inline-block w-4 border-t-2 align-middle" style={{ borderColor: traceColors.pv }} />PV (as measured)</span>
        <span><span aria-hidden className="mr-1 inline-block w-4 border-t-2 align-middle" style={{ borderColor: traceColors.out }} />OUT, right axis</span>
      </figcaption>
    </figure>
  );
}
