/**
 * The official verification of an attempt: the attempt replayed from its inputs (the drill version,
 * the starting controller, the stamped action log, the seed the server issued), the reference
 * tuning run on the same drill and seed, the score (score.ts), the standings summary (summary.ts),
 * the automatic feedback per window (feedback.ts) and the trace fingerprint (trace-hash.ts).
 * Pure and deterministic: the same inputs and engine version give the same document, which is what
 * lets the server re-run a browser's attempt and compare (claim-check.ts).
 */
import { controllerConfigSchema } from "../control/config";
import { ENGINE_VERSION } from "../version";
import { actionLogSchema } from "./actions";
import { windowFeedback } from "./feedback";
import { runDrill } from "./run-drill";
import { drillSchema } from "./schema";
import { scoreAttempt } from "./score";
import { attemptSummary } from "./summary";
import { traceFingerprint } from "./trace-hash";

export interface OfficialVerification {
  engineVersion: string;
  fingerprint: string;
  results: ReturnType<typeof runDrill>["results"];
  score: ReturnType<typeof scoreAttempt>;
  summary: ReturnType<typeof attemptSummary>;
  windows: ReturnType<typeof windowFeedback>;
  violations: string[];
}

/** Validates the inputs with the engine's schemas (throws on invalid ones) and replays. */
export function replayAttempt(p: { drill: unknown; controller: unknown; actionLog: unknown; seed: number; latePenaltyFactor: number }): OfficialVerification {
  const drill = drillSchema.parse(p.drill);
  const controller = controllerConfigSchema.parse(p.controller);
  const actions = actionLogSchema.parse(p.actionLog);
  const attempt = runDrill(drill, controller, actions, p.seed);
  const reference = runDrill(drill, drill.referenceTuning, [], p.seed);
  const score = scoreAttempt(drill, attempt.results, reference.results);
  return {
    engineVersion: ENGINE_VERSION,
    fingerprint: traceFingerprint(attempt.trace),
    results: attempt.results,
    score,
    summary: attemptSummary(attempt.results, score, p.latePenaltyFactor),
    windows: windowFeedback(drill, attempt.results, reference.results, score),
    violations: attempt.results.controllerViolations,
  };
}

