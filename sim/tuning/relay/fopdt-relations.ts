/**
 * Exact relations between an FOPDT K e^{−θs}/(τs + 1) and its oscillation under feedback.
 * - Ultimate point: the phase-crossover equation θω + atan(τω) = π (solved by bisection on
 *   0 < ω < π/θ), Ku = √(1 + (τωu)²)/K, Pu = 2π/ωu.
 * - Exact relay limit cycle for a symmetric relay ±h with hysteresis ε (references §1; closed
 *   forms derived there and verified numerically; the book source is MEMORY):
 *     a = Kh − (Kh − ε) e^{−θ/τ},  Th = θ + τ ln[(Kh + a)/(Kh − ε)]   (period 2Th).
 * - FOPDT from the ultimate point and a known gain K (the FOPDT's magnitude and phase at ωu):
 *     τ = √((K·Ku)² − 1)/ωu,  θ = (π − atan(τωu))/ωu; needs K·Ku > 1.
 */
import type { FopdtModel } from "../models";
import { bisect } from "../numeric/one-dimensional-search";

export function fopdtUltimatePoint(k: number, tau: number, theta: number): { ku: number; puS: number; omegaU: number } {
  const omegaU = bisect((w) => theta * w + Math.atan(tau * w) - Math.PI, 1e-12, Math.PI / theta, 200);
  return { ku: Math.hypot(1, tau * omegaU) / k, puS: (2 * Math.PI) / omegaU, omegaU };
}

export function fopdtRelayLimitCycle(k: number, tau: number, theta: number, h: number, eps = 0): { amplitude: number; halfPeriodS: number } {
  const kh = k * h;
  const amplitude = kh - (kh - eps) * Math.exp(-theta / tau);
  return { amplitude, halfPeriodS: theta + tau * Math.log((kh + amplitude) / (kh - eps)) };
}

export type FopdtFromUltimate = { ok: true; model: FopdtModel } | { ok: false; reason: string };

export function fopdtFromUltimate(gainCPerPercent: number, ku: number, puS: number): FopdtFromUltimate {
  const k = Math.abs(gainCPerPercent);
  if (!(k > 0 && ku > 0 && puS > 0 && Number.isFinite(k * ku * puS))) return { ok: false, reason: "gain, Ku and Pu must be positive numbers" };
  const kk = k * ku;
  if (kk <= 1) return { ok: false, reason: `K·Ku = ${+kk.toPrecision(3)} ≤ 1: an FOPDT cannot have this ultimate point (the static gain is too small for the measured oscillation)` };
  const w = (2 * Math.PI) / puS;
  const tau = Math.sqrt(kk * kk - 1) / w;
  return { ok: true, model: { kind: "fopdt", gainCPerPercent: gainCPerPercent, timeConstantS: tau, deadTimeS: (Math.PI - Math.atan(tau * w)) / w } };
}
