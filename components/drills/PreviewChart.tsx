"use client";
/** The builder's preview trend: the plant under the reference tuning (true temperature, PV, SP
 * dashed, OUT on its own 0–100 % axis), with the drill's events marked and scoring windows shaded. */
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { decimateMinMax } from "@/components/trend/decimate";
import { formatElapsed } from "@/components/trend/format";
import { traceColors } from "@/tailwind.config";

export interface PreviewSeries {
  timeS: ArrayLike<number>;
  pvFilteredC: ArrayLike<number>;
  trueC: ArrayLike<number>;
  setpointC: ArrayLike<number>;
  outPercent: ArrayLike<number>;
  length: number;
}

export interface PreviewMark {
  timeS: number;
  label: string;
}

export interface PreviewWindow {
  startS: number;
  endS: number;
  label: string;
}

const GRID = "#e3e0d8";
const INK = "#4b5258";

export function PreviewChart({ series, marks, windows, fileName = "drill-preview" }: { series: PreviewSeries; marks: PreviewMark[]; windows: PreviewWindow[]; fileName?: string }) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  useEffect(() => {
    if (!host.current || series.length === 0) return;
    const x = series.timeS;
    const n = series.length;
    const d = decimateMinMax(x, [series.trueC, series.pvFilteredC, series.setpointC, series.outPercent], n, { fromX: x[0], toX: x[n - 1] }, 700);
    const fmtT = (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(2)} °C`);
    const drawOverlays = (u: uPlot) => {
      const ctx = u.ctx;
      const dpr = devicePixelRatio;
      const { top, height, left, width } = u.bbox;
      ctx.save();
      ctx.fillStyle = "rgba(75, 82, 88, 0.06)";
      for (const w of windows) {
        const x0 = Math.max(left, u.valToPos(w.startS, "x", true));
        const x1 = Math.min(left + width, u.valToPos(w.endS, "x", true));
        if (x1 > x0) ctx.fillRect(x0, top + height - 6 * dpr, x1 - x0, 6 * dpr);
      }
      ctx.font = `${10 * dpr}px var(--font-plex-sans), sans-serif`;
      ctx.strokeStyle = "#7a7f84";
      ctx.fillStyle = INK;
      ctx.lineWidth = dpr;
      ctx.setLineDash([3 * dpr, 3 * dpr]);
      marks.forEach((m, i) => {
        const px = u.valToPos(m.timeS, "x", true);
        if (px < left || px > left + width) return;
        ctx.beginPath();
        ctx.moveTo(px, top);
        ctx.lineTo(px, top + height);
        ctx.stroke();
        ctx.fillText(`▸ ${m.label}`, px + 3 * dpr, top + (11 + 12 * (i % 3)) * dpr);
      });
      ctx.restore();
    };
    const u = new uPlot(
      {
        width: host.current.clientWidth || 760,
        height: 260,
        scales: { x: { time: false }, out: { range: [0, 100] } },
        axes: [
          { values: (_u, v) => v.map(formatElapsed), font: "11px var(--font-plex-mono)", grid: { stroke: GRID } },
          { font: "11px var(--font-plex-mono)", grid: { stroke: GRID }, label: "°C", labelFont: "11px var(--font-plex-sans)" },
          { scale: "out", side: 1, font: "11px var(--font-plex-mono)", grid: { show: false }, label: "OUT %", labelFont: "11px var(--font-plex-sans)" },
        ],
        series: [
          { label: "time", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) },
          { label: "true temp.", stroke: traceColors.truth, width: 1.4, value: fmtT },
          { label: "PV (filtered)", stroke: traceColors.pvFiltered, width: 1.2, value: fmtT },
          { label: "SP", stroke: traceColors.sp, dash: [6, 4], width: 1.25, value: fmtT },
          { label: "OUT", stroke: traceColors.out, width: 1, scale: "out", value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} %`) },
        ],
        legend: { live: true },
        hooks: { draw: [drawOverlays] },
      },
      [d.x, ...d.series] as uPlot.AlignedData,
      host.current,
    );
    plot.current = u;
    return () => {
      plot.current = null;
      u.destroy();
    };
  }, [series, marks, windows]);
  const exportPng = () => {
    const canvas = plot.current?.ctx.canvas;
    if (!canvas) return;
    const a = document.createElement("a");
    a.href = canvas.toDataURL("image/png");
    a.download = `${fileName}.png`;
    a.click();
  };
  return (
    <div className="space-y-1">
      <div ref={host} className="lw-trend" data-testid="drill-preview-chart" />
      <button type="button" onClick={exportPng} className="text-xs text-ink-soft underline decoration-rule-strong hover:text-ink">
        Export chart (PNG)
      </button>
    </div>
  );
}
