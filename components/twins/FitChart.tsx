"use client";
/**
 * One candidate against the data: PV as logged with the model's response over it, and below, on
 * its own strip, the residual (data − model, °C) around a zero line. The two charts share the
 * cursor. A good fit leaves a residual that looks like the sensor noise, without a pattern.
 */
import { useEffect, useId, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { traceColors } from "@/tailwind.config";
import { celsius, elapsed, exportPng, INK, MODEL_STROKE, timeAxis, valueAxis } from "./chart-kit";
import type { FitSeries } from "./fit-series";

export function FitChart({ series, label, fileName, height = 180 }: { series: FitSeries; label: string; fileName: string; height?: number }) {
  const hostFit = useRef<HTMLDivElement>(null);
  const hostRes = useRef<HTMLDivElement>(null);
  const plots = useRef<{ fit: uPlot; res: uPlot } | null>(null);
  const syncKey = useId();
  useEffect(() => {
    if (!hostFit.current || !hostRes.current || series.t.length === 0) return;
    const width = hostFit.current.clientWidth || 360;
    const sync = uPlot.sync(syncKey);
    const cursor = { sync: { key: sync.key } };
    const fit = new uPlot(
      {
        width,
        height,
        cursor,
        scales: { x: { time: false } },
        axes: [timeAxis(), valueAxis("T", "°C")],
        series: [
          { label: "time", value: elapsed },
          { label: "PV (data)", stroke: traceColors.pv, width: 1.2, scale: "T", value: celsius },
          { label: label, stroke: MODEL_STROKE, width: 1.2, dash: [6, 3], scale: "T", value: celsius },
        ],
        legend: { live: true },
      },
      [series.t, series.pv, series.model] as uPlot.AlignedData,
      hostFit.current,
    );
    const drawZero = (u: uPlot) => {
      const y = u.valToPos(0, "R", true);
      const { left, width: w, top, height: h } = u.bbox;
      if (y < top || y > top + h) return;
      u.ctx.save();
      u.ctx.strokeStyle = INK;
      u.ctx.lineWidth = devicePixelRatio;
      u.ctx.beginPath();
      u.ctx.moveTo(left, y);
      u.ctx.lineTo(left + w, y);
      u.ctx.stroke();
      u.ctx.restore();
    };
    const res = new uPlot(
      {
        width,
        height: Math.round(height * 0.55),
        cursor,
        scales: { x: { time: false }, R: { range: (_u, lo, hi) => { const m = Math.max(Math.abs(lo), Math.abs(hi), 1e-3); return [-m, m]; } } },
        axes: [timeAxis(), valueAxis("R", "residual °C")],
        series: [
          { label: "time", value: elapsed },
          { label: "data − model", stroke: traceColors.pv, width: 1, scale: "R", value: celsius },
        ],
        legend: { live: true },
        hooks: { draw: [drawZero] },
      },
      [series.t, series.residual] as uPlot.AlignedData,
      hostRes.current,
    );
    plots.current = { fit, res };
    return () => {
      plots.current = null;
      fit.destroy();
      res.destroy();
    };
  }, [series, label, height, syncKey]);
  return (
    <figure className="space-y-1">
      <div ref={hostFit} className="lw-trend text-[10px]" data-testid="fit-chart" />
      <div ref={hostRes} className="lw-trend text-[10px]" data-testid="residual-chart" />
      <figcaption className="flex justify-end text-xs text-ink-faint">
        <button type="button" onClick={() => exportPng([plots.current?.fit ?? null, plots.current?.res ?? null], fileName)} className="underline decoration-rule-strong hover:text-ink">
          Export chart (PNG)
        </button>
      </figcaption>
    </figure>
  );
}
