"use client";
/** The mapped log before identification: PV (and SP, dashed) on the temperature axis, OUT on its own 0–100 % axis. */
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { traceColors } from "@/tailwind.config";
import { celsius, elapsed, exportPng, percent, timeAxis, valueAxis } from "./chart-kit";
import type { LogSeries } from "./fit-series";

export function LogPreviewChart({ series, fileName }: { series: LogSeries; fileName: string }) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  useEffect(() => {
    if (!host.current || series.t.length === 0) return;
    const s: uPlot.Series[] = [
      { label: "time", value: elapsed },
      { label: "PV", stroke: traceColors.pv, width: 1.2, scale: "T", value: celsius },
      ...(series.sp ? [{ label: "SP", stroke: traceColors.sp, dash: [6, 4], width: 1.2, scale: "T", value: celsius }] : []),
      { label: "OUT", stroke: traceColors.out, width: 1.2, scale: "%", value: percent },
    ];
    const data = [series.t, series.pv, ...(series.sp ? [series.sp] : []), series.out] as uPlot.AlignedData;
    const u = new uPlot(
      {
        width: host.current.clientWidth || 760,
        height: 240,
        scales: { x: { time: false }, "%": { range: [0, 100] } },
        axes: [timeAxis(), valueAxis("T", "°C"), valueAxis("%", "OUT %", 1, false)],
        series: s,
        legend: { live: true },
      },
      data,
      host.current,
    );
    plot.current = u;
    return () => {
      plot.current = null;
      u.destroy();
    };
  }, [series]);
  return (
    <figure className="space-y-1">
      <div ref={host} className="lw-trend" data-testid="log-preview-chart" />
      <figcaption className="flex justify-between text-xs text-ink-faint">
        <span>The log as mapped: time from the first row, PV and SP in °C, OUT in %.</span>
        <button type="button" onClick={() => exportPng([plot.current], `${fileName}-preview`)} className="underline decoration-rule-strong hover:text-ink">
          Export chart (PNG)
        </button>
      </figcaption>
    </figure>
  );
}
