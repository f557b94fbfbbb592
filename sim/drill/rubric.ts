/**
 * "How this attempt is scored", shown before an attempt: a plain data view of the drill's scoring
 * (score.ts's SCORE_FORMULA, the windows and their share of the weight, metric weights in %),
 * its rules (what may be changed), pace and seed policy. Method: a read-out of the parsed drill;
 * shares are each weight over the sum of weights.
 */
import type { Drill } from "./schema";
import { SCORE_FORMULA } from "./score";

export interface DrillRubric {
  formula: string;
  windows: { id: string; label: string; kind: "setpoint" | "disturbance"; startS: number; endS: number; weight: number; sharePct: number }[];
  /** metric weights normalised to a total of 100 % */
  metricWeightsPct: { iae: number; peak: number; time: number };
  bandFloorC: number;
  tripPenaltyFactor: number;
  mayChange: { tuning: true; pvFilter: boolean; sampleTime: boolean; operation: boolean; relayTest: boolean; bumpTest: boolean };
  pace: { speeds: number[]; pauseAllowed: boolean };
  seed: { policy: "fixed" | "per-attempt"; seed: number | null };
}

export function drillRubric(drill: Drill): DrillRubric {
  const wSum = drill.scoring.windows.reduce((s, w) => s + w.weight, 0);
  const m = drill.scoring.metricWeights;
  const mSum = m.iae + m.peak + m.time;
  const t = drill.trainee;
  return {
    formula: SCORE_FORMULA,
    windows: drill.scoring.windows.map((w) => ({
      id: w.id,
      label: w.label ?? w.id,
      kind: w.kind,
      startS: w.startS,
      endS: w.endS,
      weight: w.weight,
      sharePct: (100 * w.weight) / wSum,
    })),
    metricWeightsPct: { iae: (100 * m.iae) / mSum, peak: (100 * m.peak) / mSum, time: (100 * m.time) / mSum },
    bandFloorC: drill.scoring.bandFloorC,
    tripPenaltyFactor: drill.scoring.tripPenaltyFactor,
    mayChange: {
      tuning: true,
      pvFilter: t.mayChange.pvFilter,
      sampleTime: t.mayChange.sampleTime,
      operation: t.mayChange.operation,
      relayTest: t.relayTestAllowed,
      bumpTest: t.bumpTestAllowed,
    },
    pace: { speeds: [...drill.pace.speeds], pauseAllowed: drill.pace.pauseAllowed },
    // a fixed seed is the same for everyone (shown); a per-attempt seed is drawn by the app
    seed: { policy: drill.noise.seedPolicy, seed: drill.noise.seedPolicy === "fixed" ? drill.noise.seed : null },
  };
}
