"use client";
/** Overlaid true-temperature trends of an experiment's runs (one uPlot, one series per run). */
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import type { VariantRun } from "@/sim/experiments/variants";
import { decimateMinMax } from "@/components/trend/decimate";
import { formatElapsed } from "@/components/trend/format";

// distinguishable but quiet run colours (traces only; no alarm red)
const RUN_COLORS = ["#4b4fa6", "#2f8f86", "#d9692b", "#4a6f8f", "#8a6d1d", "#6b4a8f", "#3d6b4f", "#8f4a6f"];

export function OverlayChart({ rows }: { rows: VariantRun[] }) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!host.current || rows.length === 0 || rows[0].timeS.length === 0) return;
    const x = rows[0].timeS;
    const n = x.length;
    const d = decimateMinMax(x, rows.map((r) => r.trueC), n, { fromX: x[0], toX: x[n - 1] }, 600);
    const u = new uPlot(
      {
        width: host.current.clientWidth || 700,
        height: 220,
        scales: { x: { time: false } },
        axes: [
          { values: (_u, v) => v.map(formatElapsed), font: "11px var(--font-plex-mono)", grid: { stroke: "#e3e0d8" } },
          { font: "11px var(--font-plex-mono)", grid: { stroke: "#e3e0d8" }, label: "true temp. °C", labelFont: "11px var(--font-plex-sans)" },
        ],
        series: [{ label: "time", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) }, ...rows.map((r, i) => ({ label: r.label, stroke: RUN_COLORS[i % RUN_COLORS.length], width: 1.4, value: (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(2)} °C`) }))],
        legend: { live: true },
      },
      [d.x, ...d.series] as uPlot.AlignedData,
      host.current,
    );
    return () => u.destroy();
  }, [rows]);
  return <div ref={host} className="lw-trend" data-testid="experiment-overlay" />;
}
