"use client";
/**
 * The Bench trend: temperatures on top (SP dashed graphite, PV raw faint steel blue, PV filtered
 * indigo, true temperature teal dotted), OUT % on its own 0–100 % strip below with the heater's
 * on/off state, event flags on both. Two uPlot charts with a synced cursor. Data are decimated
 * per pixel column (min and max kept) on every animation frame the trace changed, so long runs
 * never hide a spike and never block the main thread.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { traceColors } from "@/tailwind.config";
import { temperatureToDisplay, type TemperatureUnit } from "@/sim/units";
import { traceToCsv } from "@/sim/drill/trace";
import type { SimEvent } from "@/sim/drill/simulation";
import type { TraceBuffer } from "@/components/bench/trace-buffer";
import { decimateMinMax } from "./decimate";
import { formatElapsed } from "./format";

export interface TrendProps {
  buffer: TraceBuffer;
  events: SimEvent[];
  unit: TemperatureUnit;
  showTruth: boolean;
  showRaw: boolean;
  /** an overlaid comparison (e.g. a saved run) drawn faint: time and PV filtered */
  overlay?: { label: string; timeS: ArrayLike<number>; pvC: ArrayLike<number>; length: number } | null;
}

type View = { follow: true; windowS: number } | { follow: false; fromS: number; toS: number };

const WINDOWS: { label: string; s: number }[] = [
  { label: "5 min", s: 300 },
  { label: "15 min", s: 900 },
  { label: "1 h", s: 3600 },
  { label: "2 h", s: 7200 },
  { label: "all", s: Infinity },
];

const INK = "#4b5258";
const RULE = "#e3e0d8";
const FLAG = "#7c848a";

function flagLabel(e: SimEvent): string {
  if (e.type === "safety-trip") return "CUTOUT TRIP";
  if (e.type === "cutout-reset") return "cutout reset";
  return e.detail.replace(/^disturbance /, "");
}

function drawFlags(u: uPlot, events: SimEvent[], withLabels: boolean) {
  const ctx = u.ctx;
  const { top, height } = u.bbox;
  ctx.save();
  ctx.font = `${10 * devicePixelRatio}px var(--font-plex-sans), sans-serif`;
  // labels closer than their width stack downwards instead of overprinting
  let lastX = -Infinity;
  let lastEnd = -Infinity;
  let row = 0;
  for (const e of events) {
    if (e.type === "action" && !/^(setpoint|mode|disturbance)/.test(e.detail)) continue;
    const x = u.valToPos(e.timeS, "x", true);
    if (x < u.bbox.left || x > u.bbox.left + u.bbox.width) continue;
    const alarm = e.type === "safety-trip";
    ctx.strokeStyle = alarm ? "#c62828" : FLAG;
    ctx.setLineDash([3 * devicePixelRatio, 3 * devicePixelRatio]);
    ctx.lineWidth = devicePixelRatio;
    ctx.beginPath();
    ctx.moveTo(x, top);
    ctx.lineTo(x, top + height);
    ctx.stroke();
    if (withLabels) {
      const text = `▸ ${flagLabel(e)}`;
      row = x < lastEnd && x - lastX < 400 * devicePixelRatio ? (row + 1) % 4 : 0;
      ctx.fillStyle = alarm ? "#c62828" : INK;
      ctx.fillText(text, x + 3 * devicePixelRatio, top + (11 + 12 * row) * devicePixelRatio);
      lastX = x;
      lastEnd = Math.max(row === 0 ? -Infinity : lastEnd, x + ctx.measureText(text).width + 6 * devicePixelRatio);
    }
  }
  ctx.restore();
}

export function Trend({ buffer, events, unit, showTruth, showRaw, overlay }: TrendProps) {
  const hostTemp = useRef<HTMLDivElement>(null);
  const hostOut = useRef<HTMLDivElement>(null);
  const plots = useRef<{ temp: uPlot; out: uPlot } | null>(null);
  const [view, setView] = useState<View>({ follow: true, windowS: 900 });
  const [yRange, setYRange] = useState<{ min: string; max: string }>({ min: "", max: "" });
  const live = useRef({ view, events, unit, overlay, yRange, drawnVersion: -1 });
  live.current.view = view;
  live.current.events = events;
  live.current.unit = unit;
  live.current.overlay = overlay;
  live.current.yRange = yRange;

  const currentRange = useCallback((): [number, number] => {
    const v = live.current.view;
    const n = buffer.length;
    const end = n ? buffer.columns.timeS[n - 1] : 0;
    if (v.follow) {
      const from = Number.isFinite(v.windowS) ? Math.max(0, end - v.windowS) : 0;
      return [from, Math.max(from + 10, Number.isFinite(v.windowS) ? from + v.windowS : end)];
    }
    return [v.fromS, v.toS];
  }, [buffer]);

  const redraw = useCallback(() => {
    const p = plots.current;
    if (!p) return;
    const [fromS, toS] = currentRange();
    const cols = Math.max(50, Math.floor(p.temp.bbox.width / devicePixelRatio));
    const c = buffer.columns;
    const d = decimateMinMax(c.timeS, [c.setpointC, c.pvRawC, c.pvFilteredC, c.trueC, c.outPercent, c.heaterOn], buffer.length, { fromX: fromS, toX: toS }, cols);
    const u = live.current.unit;
    const conv = (arr: number[]) => (u === "C" ? arr : arr.map((v) => temperatureToDisplay(v, u)));
    const ov = live.current.overlay;
    let overlaySeries: (number | null)[] = d.x.map(() => null);
    if (ov && ov.length > 1) {
      // sample the overlay at the plotted x positions (same sample time assumed: nearest row)
      const dt = ov.timeS[1] - ov.timeS[0];
      overlaySeries = d.x.map((x) => {
        const i = Math.round((x - ov.timeS[0]) / dt);
        return i >= 0 && i < ov.length ? temperatureToDisplay(ov.pvC[i], u) : null;
      });
    }
    p.temp.batch(() => {
      p.temp.setData([d.x, conv(d.series[0]), conv(d.series[1]), conv(d.series[2]), conv(d.series[3]), overlaySeries] as uPlot.AlignedData, true);
    });
    p.out.setData([d.x, d.series[4], d.series[5]] as uPlot.AlignedData, true);
    live.current.drawnVersion = buffer.version;
    // redraw counter read by the browser benchmark (tests/perf/bench-browser.ts)
    const w = window as unknown as { __loopwrightTrendDraws?: number };
    w.__loopwrightTrendDraws = (w.__loopwrightTrendDraws ?? 0) + 1;
  }, [buffer, currentRange]);

  // create the charts once
  useEffect(() => {
    if (!hostTemp.current || !hostOut.current) return;
    const width = hostTemp.current.clientWidth || 800;
    const xScale: uPlot.Scale = { time: false, range: () => currentRange() };
    const xAxis: uPlot.Axis = {
      stroke: INK,
      grid: { stroke: RULE, width: 1 },
      ticks: { stroke: RULE },
      values: (_u, vals) => vals.map(formatElapsed),
      font: "11px var(--font-plex-mono), monospace",
    };
    const tUnit = () => `°${live.current.unit}`;
    const fmtT = (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(2)} ${tUnit()}`);
    const sync = uPlot.sync("bench-trend");
    const select = (u: uPlot) => {
      if (u.select.width < 4) return;
      const fromS = u.posToVal(u.select.left, "x");
      const toS = u.posToVal(u.select.left + u.select.width, "x");
      u.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
      setView({ follow: false, fromS, toS });
    };
    const temp = new uPlot(
      {
        width,
        height: 300,
        scales: {
          x: xScale,
          y: {
            range: (_u, min, max) => {
              const r = live.current.yRange;
              const lo = r.min !== "" && Number.isFinite(Number(r.min)) ? Number(r.min) : min;
              const hi = r.max !== "" && Number.isFinite(Number(r.max)) ? Number(r.max) : max;
              const pad = Math.max(0.5, (hi - lo) * 0.08);
              return [r.min !== "" ? lo : lo - pad, r.max !== "" ? hi : hi + pad];
            },
          },
        },
        axes: [
          { ...xAxis, show: false },
          { stroke: INK, grid: { stroke: RULE, width: 1 }, ticks: { stroke: RULE }, font: "11px var(--font-plex-mono), monospace", label: "temperature", labelFont: "11px var(--font-plex-sans)", size: 56 },
        ],
        series: [
          { label: "time", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) },
          { label: "SP", stroke: traceColors.sp, dash: [6, 4], width: 1.25, value: fmtT },
          { label: "PV raw", stroke: `${traceColors.pv}66`, width: 1, value: fmtT, show: showRaw },
          { label: "PV filtered", stroke: traceColors.pvFiltered, width: 1.6, value: fmtT },
          { label: "true temp.", stroke: traceColors.truth, dash: [2, 3], width: 1.4, value: fmtT, show: showTruth },
          { label: "compared run", stroke: "#9aa0a6", width: 1.2, dash: [1, 2], value: fmtT, show: false },
        ],
        cursor: { sync: { key: sync.key }, drag: { x: true, y: false, setScale: false } },
        hooks: { setSelect: [select], draw: [(u) => drawFlags(u, live.current.events, true)] },
        legend: { live: true },
      },
      [[], [], [], [], [], []],
      hostTemp.current,
    );
    const out = new uPlot(
      {
        width,
        height: 130,
        scales: { x: xScale, y: { range: [0, 100] }, heater: { range: [0, 12] } },
        axes: [
          xAxis,
          { stroke: INK, grid: { stroke: RULE, width: 1 }, ticks: { stroke: RULE }, font: "11px var(--font-plex-mono), monospace", label: "OUT %", labelFont: "11px var(--font-plex-sans)", size: 56, splits: () => [0, 50, 100] },
          { scale: "heater", show: false },
        ],
        series: [
          { label: "time", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) },
          { label: "OUT", stroke: traceColors.out, width: 1.5, value: (_u, v) => (v == null ? "—" : `${v.toFixed(1)} %`) },
          { label: "heater", scale: "heater", stroke: `${traceColors.out}88`, width: 1, paths: uPlot.paths.stepped!({ align: 1 }), value: (_u, v) => (v == null ? "—" : v > 0.5 ? "on" : "off") },
        ],
        cursor: { sync: { key: sync.key }, drag: { x: true, y: false, setScale: false } },
        hooks: { setSelect: [select], draw: [(u) => drawFlags(u, live.current.events, false)] },
        legend: { live: true },
      },
      [[], [], []],
      hostOut.current,
    );
    plots.current = { temp, out };
    const resize = new ResizeObserver(() => {
      const w = hostTemp.current?.clientWidth ?? width;
      temp.setSize({ width: w, height: 300 });
      out.setSize({ width: w, height: 130 });
      live.current.drawnVersion = -1;
    });
    resize.observe(hostTemp.current);
    let frame = 0;
    const loop = () => {
      if (live.current.drawnVersion !== buffer.version) redraw();
      frame = requestAnimationFrame(loop);
    };
    frame = requestAnimationFrame(loop);
    return () => {
      cancelAnimationFrame(frame);
      resize.disconnect();
      temp.destroy();
      out.destroy();
      plots.current = null;
    };
    // created once per buffer; later prop changes are applied below without rebuilding
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [buffer]);

  useEffect(() => {
    const p = plots.current;
    if (!p) return;
    p.temp.setSeries(2, { show: showRaw });
    p.temp.setSeries(4, { show: showTruth });
  }, [showRaw, showTruth]);

  useEffect(() => {
    plots.current?.temp.setSeries(5, { show: !!overlay });
  }, [overlay]);

  useEffect(() => {
    live.current.drawnVersion = -1; // view, unit, events, overlay or y-range changed: redraw next frame
  }, [view, unit, events, overlay, yRange]);

  const pan = (fraction: number) => {
    const [fromS, toS] = currentRange();
    const shift = (toS - fromS) * fraction;
    setView({ follow: false, fromS: Math.max(0, fromS + shift), toS: Math.max(10, toS + shift) });
  };

  const exportPng = () => {
    const p = plots.current;
    if (!p) return;
    const a = p.temp.ctx.canvas;
    const b = p.out.ctx.canvas;
    const canvas = document.createElement("canvas");
    canvas.width = Math.max(a.width, b.width);
    canvas.height = a.height + b.height;
    const ctx = canvas.getContext("2d")!;
    ctx.fillStyle = "#fbfaf7";
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(a, 0, 0);
    ctx.drawImage(b, 0, a.height);
    download(canvas.toDataURL("image/png"), "loopwright-trend.png");
  };

  const exportCsv = () => {
    const blob = new Blob([traceToCsv(buffer.view())], { type: "text/csv" });
    const url = URL.createObjectURL(blob);
    download(url, "loopwright-trace.csv");
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };

  return (
    <div className="space-y-2" data-testid="trend">
      <div className="flex flex-wrap items-center gap-2 text-xs text-ink-soft">
        <span className="font-medium uppercase tracking-wide text-ink-faint">Window</span>
        {WINDOWS.map((w) => (
          <button
            key={w.label}
            type="button"
            onClick={() => setView({ follow: true, windowS: w.s })}
            className={`rounded-sm border px-2 py-0.5 ${view.follow && view.windowS === w.s ? "border-ink bg-ink text-paper" : "border-rule-strong hover:border-ink"}`}
          >
            {w.label}
          </button>
        ))}
        <button type="button" onClick={() => pan(-0.5)} className="rounded-sm border border-rule-strong px-2 py-0.5 hover:border-ink" aria-label="Pan back">
          ◀
        </button>
        <button type="button" onClick={() => pan(0.5)} className="rounded-sm border border-rule-strong px-2 py-0.5 hover:border-ink" aria-label="Pan forward">
          ▶
        </button>
        {!view.follow ? (
          <button type="button" onClick={() => setView({ follow: true, windowS: 900 })} className="rounded-sm border border-trace-pv px-2 py-0.5 text-trace-pv">
            back to live
          </button>
        ) : null}
        <span className="ml-3 font-medium uppercase tracking-wide text-ink-faint">Y</span>
        <label className="flex items-center gap-1">
          <span className="sr-only">Y minimum</span>
          <input value={yRange.min} onChange={(e) => setYRange({ ...yRange, min: e.target.value })} placeholder="auto" className="num w-14 rounded-sm border border-rule-strong bg-paper-raised px-1 py-0.5" />
        </label>
        <span>–</span>
        <label className="flex items-center gap-1">
          <span className="sr-only">Y maximum</span>
          <input value={yRange.max} onChange={(e) => setYRange({ ...yRange, max: e.target.value })} placeholder="auto" className="num w-14 rounded-sm border border-rule-strong bg-paper-raised px-1 py-0.5" />
        </label>
        <span className="num">°{unit}</span>
        <span className="ml-auto flex gap-2">
          <button type="button" onClick={exportPng} className="underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
            Export PNG
          </button>
          <button type="button" onClick={exportCsv} className="underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
            CSV
          </button>
        </span>
      </div>
      <p className="text-[11px] text-ink-faint">Drag across the chart to zoom in on a span.</p>
      <div ref={hostTemp} className="lw-trend" />
      <div ref={hostOut} className="lw-trend" />
    </div>
  );
}

function download(href: string, name: string) {
  const a = document.createElement("a");
  a.href = href;
  a.download = name;
  a.click();
}
