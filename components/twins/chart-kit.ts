/** Shared look of the twin charts (the trend's axes and grid) and the PNG export every chart offers. */
import type uPlot from "uplot";
import { formatElapsed } from "@/components/trend/format";

export const GRID = "#e3e0d8";
export const INK = "#4b5258";
/** a fitted model's line: ink, dashed, so it never reads as a measured trace */
export const MODEL_STROKE = "#1f2326";

export const timeAxis = (): uPlot.Axis => ({ values: (_u, v) => v.map(formatElapsed), font: "11px var(--font-plex-mono)", grid: { stroke: GRID }, stroke: INK });

export const valueAxis = (scale: string, label: string, side: 1 | 3 = 3, grid = true): uPlot.Axis => ({
  scale,
  side,
  label,
  stroke: INK,
  font: "11px var(--font-plex-mono)",
  labelFont: "11px var(--font-plex-sans)",
  grid: grid ? { stroke: GRID } : { show: false },
  size: 52,
});

export const celsius = (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(2)} °C`);
export const percent = (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(1)} %`);
export const elapsed = (_u: uPlot, v: number | null) => (v == null ? "—" : formatElapsed(v));

export function exportPng(plots: (uPlot | null)[], fileName: string) {
  const canvases = plots.filter((p): p is uPlot => p !== null).map((p) => p.ctx.canvas);
  if (canvases.length === 0) return;
  // stacked charts go out as one picture, top to bottom
  const out = document.createElement("canvas");
  out.width = Math.max(...canvases.map((c) => c.width));
  out.height = canvases.reduce((h, c) => h + c.height, 0);
  const ctx = out.getContext("2d");
  if (!ctx) return;
  ctx.fillStyle = "#fbfaf7";
  ctx.fillRect(0, 0, out.width, out.height);
  let y = 0;
  for (const c of canvases) {
    ctx.drawImage(c, 0, y);
    y += c.height;
  }
  const a = document.createElement("a");
  a.href = out.toDataURL("image/png");
  a.download = `${fileName}.png`;
  a.click();
}
