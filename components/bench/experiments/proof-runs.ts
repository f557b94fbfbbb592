/**
 * A finished PI vs PID comparison on a site proof test, as proof runs: each run with the drill,
 * controller and seed it ran and its headline results, so a tuning record can carry exactly
 * what was run (and the server can run it again).
 */
import type { ProofRun, SiteProof } from "../store";
import type { VariantRun } from "@/sim/experiments/variants";

export function proofRunsOf(proof: SiteProof & { seed: number }, rows: readonly VariantRun[], stamp: string): ProofRun[] {
  return rows.map((r) => {
    // the comparison's labels start with the side: "PI (Kc …)", "PID (Kc …)"
    const tuningLabel = r.label.split(" ")[0];
    const overshoots = r.results.windows.map((w) => w.trueTemperature.overshootPct).filter((v): v is number => v != null);
    const iae = r.results.wholeRun.trueTemperature.iae;
    return {
      key: `${stamp}-${r.index}`,
      label: `${proof.label} · ${tuningLabel}`.slice(0, 80),
      tuningLabel,
      drill: proof.drill,
      drillVersion: proof.drillVersion,
      controller: r.controller,
      seed: proof.seed,
      iae: Number.isFinite(iae) ? iae : null,
      overshootPct: overshoots.length ? Math.max(...overshoots) : null,
    };
  });
}
