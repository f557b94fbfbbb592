"use client";
/**
 * A bump test's record with the fitted responses: PV as logged (the PV the controller sees), the
 * FOPDT and SOPDT model responses to the same OUT, and OUT on its own 0–100 % axis. Time is
 * counted from the step. The record is a few hundred rows (dense then sparse logging), so no
 * decimation is needed.
 */
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { traceColors } from "@/tailwind.config";
import { formatElapsed } from "@/components/trend/format";
import { temperatureToDisplay, type TemperatureUnit } from "@/sim/units";

export interface BumpChartProps {
  t: number[];
  out: number[];
  pv: number[];
  fopdt: number[];
  sopdt: number[] | null;
  stepTimeS: number;
  unit: TemperatureUnit;
}

export function BumpChart({ t, out, pv, fopdt, sopdt, stepTimeS, unit }: BumpChartProps) {
  const host = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!host.current || t.length === 0) return;
    const x = t.map((v) => v - stepTimeS);
    const d = (ys: number[]) => ys.map((v) => temperatureToDisplay(v, unit));
    const T = `°${unit}`;
    const fmt = (v: number | null) => (v == null ? "—" : `${v.toFixed(2)} ${T}`);
    const series: uPlot.Series[] = [
      { label: "from step", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) },
      { label: "PV", stroke: traceColors.pvFiltered, width: 1.2, scale: "T", value: (_u, v) => fmt(v) },
      { label: "FOPDT", stroke: "#1f2326", width: 1.2, dash: [6, 3], scale: "T", value: (_u, v) => fmt(v) },
      ...(sopdt ? [{ label: "SOPDT", stroke: "#6b4a8f", width: 1.2, dash: [2, 2], scale: "T", value: (_u: uPlot, v: number | null) => fmt(v) }] : []),
      { label: "OUT", stroke: traceColors.out, width: 1.2, scale: "%", value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} %`) },
    ];
    const data = [x, d(pv), d(fopdt), ...(sopdt ? [d(sopdt)] : []), out] as uPlot.AlignedData;
    const u = new uPlot(
      {
        width: host.current.clientWidth || 290,
        height: 190,
        scales: { x: { time: false }, "%": { range: [0, 100] } },
        axes: [
          { values: (_u, v) => v.map(formatElapsed), font: "10px var(--font-plex-mono)", grid: { stroke: "#e3e0d8" } },
          { scale: "T", font: "10px var(--font-plex-mono)", grid: { stroke: "#e3e0d8" }, size: 44 },
          { scale: "%", side: 1, font: "10px var(--font-plex-mono)", grid: { show: false }, size: 34 },
        ],
        series,
        legend: { live: true },
      },
      data,
      host.current,
    );
    return () => u.destroy();
  }, [t, out, pv, fopdt, sopdt, stepTimeS, unit]);
  return <div ref={host} className="lw-trend text-[10px]" data-testid="bump-chart" />;
}
