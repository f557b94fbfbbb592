/**
 * How a twin's model reads in lists and cards: K in °C/%, time constants and dead time in s
 * (with minutes beside them once they pass two minutes), fit figures to sensible digits.
 * Every number carries its unit.
 */
import { mebibytesText } from "@/sim/import/byte-size";

export interface ModelFigures {
  gainCPerPercent: number;
  timeConstantsS: readonly number[];
  deadTimeS: number;
}

/** A figure to three significant digits, without trailing zeros (0.600 → 0.6, 1234 → 1234). */
export function sig3(x: number): string {
  if (!Number.isFinite(x)) return "—";
  if (Math.abs(x) >= 1000) return String(Math.round(x));
  return String(+x.toPrecision(3));
}

export function seconds(s: number): string {
  if (!Number.isFinite(s)) return "—";
  return s >= 120 ? `${sig3(s)} s (${sig3(s / 60)} min)` : `${sig3(s)} s`;
}

export const gainText = (k: number) => `${sig3(k)} °C/%`;

/** "τ 150 s" or "τ1 150 s, τ2 12.3 s". */
export function timeConstantsText(taus: readonly number[]): string {
  if (taus.length === 1) return `τ ${seconds(taus[0])}`;
  return taus.map((t, i) => `τ${i + 1} ${seconds(t)}`).join(", ");
}

export function modelSummary(m: ModelFigures): string {
  return `K ${gainText(m.gainCPerPercent)} · ${timeConstantsText(m.timeConstantsS)} · θ ${seconds(m.deadTimeS)}`;
}

export const r2Text = (r2: number) => (Number.isFinite(r2) ? r2.toFixed(4) : "—");
export const percentText = (x: number) => (Number.isFinite(x) ? `${sig3(100 * x)} %` : "—");
export const celsiusText = (c: number | null | undefined) => (c == null || !Number.isFinite(c) ? "—" : `${sig3(c)} °C`);

/** A file's size: bytes, KiB to 3 significant digits, or MiB in the upload limit's words (sim/import/byte-size.ts). */
export function byteSizeText(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${sig3(n / 1024)} KiB`;
  return `${mebibytesText(n)} MiB`;
}

export const kindLabel = (k: "fopdt" | "sopdt") => (k === "fopdt" ? "FOPDT" : "SOPDT");
