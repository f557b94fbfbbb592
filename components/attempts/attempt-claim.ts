/**
 * What a trainee's Bench claims for an attempt, computed by the engine's own code: the results of
 * the streamed trace (currentRunRecord, the same computeRunResults runDrill uses, on the same
 * samples) and the score against the reference tuning run headless on the same drill and seed
 * (runDrill + scoreAttempt, exactly as the server's replay does). The server never trusts this:
 * it re-runs the attempt and only compares the claim with its own numbers.
 *
 * Also the submission itself: its idempotency key (kept in sessionStorage per attempt, so a retry
 * after a double click, a network failure or a reload sends the same key) and the payload.
 */
import { attemptSubmissionSchema, type AttemptSubmission } from "@/app/_lib/classroom/contracts";
import type { ControllerConfig } from "@/sim/control/config";
import type { StampedAction } from "@/sim/drill/actions";
import type { RunResults } from "@/sim/drill/results";
import { runDrill } from "@/sim/drill/run-drill";
import type { Drill } from "@/sim/drill/schema";
import { scoreAttempt, type AttemptScore } from "@/sim/drill/score";
import type { SimEvent } from "@/sim/drill/simulation";
import { TRACE_FLAG_COLUMNS, TRACE_FLOAT_COLUMNS, type Trace } from "@/sim/drill/trace";
import { currentRunRecord } from "@/components/bench/current-run";

/** The claim as the submission carries it (attemptSubmissionSchema's `claimed`). */
export interface AttemptClaim {
  score: number;
  results: RunResults;
  /** traceFingerprint of the streamed trace, when it covers exactly the drill's samples */
  fingerprint?: string;
}

export interface AttemptClaimInput {
  drill: Drill;
  /** the controller at the start of the run */
  controller: ControllerConfig;
  seed: number;
  actions: readonly StampedAction[];
  /** the streamed trace (the Bench's TraceBuffer view); rows past the drill's end are ignored */
  trace: Trace;
  events: SimEvent[];
  engineVersion: string;
  /** the worker's fingerprint of its trace (engine.requestFingerprint()) */
  fingerprint?: { rows: number; value: string } | null;
}

/** Index of the drill's last sample (the run covers samples 0 … lastSample). */
export function lastSampleOf(drill: Pick<Drill, "durationS">, sampleTimeS: number): number {
  return Math.round(drill.durationS / sampleTimeS);
}

/** The first `rows` rows of a trace (views, no copy). */
export function cutTrace(trace: Trace, rows: number): Trace {
  if (trace.length <= rows) return trace;
  const cut = { engineVersion: trace.engineVersion, length: rows } as Trace;
  for (const k of TRACE_FLOAT_COLUMNS) cut[k] = trace[k].subarray(0, rows);
  for (const k of TRACE_FLAG_COLUMNS) cut[k] = trace[k].subarray(0, rows);
  return cut;
}

/** The reference tuning's results on the drill and seed (what every attempt is scored against). */
export function referenceResults(drill: Drill, seed: number): RunResults {
  return runDrill(drill, drill.referenceTuning, [], seed).results;
}

/** The claim with its per-window breakdown (for showing it); `reference` may be passed in when already computed. */
export function attemptClaimDetail(p: AttemptClaimInput, reference?: RunResults): { claim: AttemptClaim; score: AttemptScore } {
  const rows = lastSampleOf(p.drill, p.controller.sampleTimeS) + 1;
  if (p.trace.length < rows) throw new Error(`the run has ${p.trace.length} of the drill's ${rows} samples: it has not reached the end`);
  const record = currentRunRecord({
    drill: p.drill,
    controller: p.controller,
    seed: p.seed,
    actions: [...p.actions],
    trace: cutTrace(p.trace, rows),
    events: p.events,
    engineVersion: p.engineVersion,
  });
  if (!record) throw new Error("the run is too short to have results");
  const score = scoreAttempt(p.drill, record.results, reference ?? referenceResults(p.drill, p.seed));
  const claim: AttemptClaim = { score: score.score, results: record.results };
  // the worker's fingerprint is of its whole trace: it is the drill's trace only with exactly its rows
  if (p.fingerprint && p.fingerprint.rows === rows) claim.fingerprint = p.fingerprint.value;
  return { claim, score };
}

/** `{ score, results, fingerprint? }` for the submission. */
export function attemptClaim(p: AttemptClaimInput, reference?: RunResults): AttemptClaim {
  return attemptClaimDetail(p, reference).claim;
}

export const SUBMISSION_KEY_PREFIX = "loopwright.submission.";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function randomUuid(): string {
  const c = globalThis.crypto;
  if (typeof c?.randomUUID === "function") return c.randomUUID();
  // RFC 4122 version 4 from getRandomValues (older browsers without randomUUID)
  const b = new Uint8Array(16);
  c.getRandomValues(b);
  b[6] = (b[6] & 0x0f) | 0x40;
  b[8] = (b[8] & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

/** Keys made in a page whose storage refuses writes (private modes): kept for the page's life. */
const memoryKeys = new Map<string, string>();

/**
 * The attempt's submission key: made once, then read back from `storage` (sessionStorage) under
 * `loopwright.submission.<attemptId>`, so every retry of this attempt's submission carries it.
 */
export function submissionKeyFor(attemptId: string, storage: Pick<Storage, "getItem" | "setItem"> | null = typeof sessionStorage === "undefined" ? null : sessionStorage): string {
  const name = SUBMISSION_KEY_PREFIX + attemptId;
  try {
    const kept = storage?.getItem(name);
    if (kept && UUID.test(kept)) return kept;
  } catch {
    // storage unavailable: fall through to the page's memory
  }
  const remembered = memoryKeys.get(name);
  if (remembered) return remembered;
  const key = randomUuid();
  memoryKeys.set(name, key);
  try {
    storage?.setItem(name, key);
  } catch {
    // kept in memory only
  }
  return key;
}

/** The submission payload, checked against the contract before it leaves the page. */
export function buildSubmission(p: { attemptId: string; submissionKey: string; controller: ControllerConfig; actionLog: readonly StampedAction[]; claim: AttemptClaim }): { ok: true; payload: string; submission: AttemptSubmission } | { ok: false; error: string } {
  const submission: AttemptSubmission = {
    attemptId: p.attemptId,
    submissionKey: p.submissionKey,
    controller: p.controller,
    actionLog: [...p.actionLog],
    claimed: {
      score: p.claim.score,
      results: p.claim.results as unknown as Record<string, unknown>,
      ...(p.claim.fingerprint ? { fingerprint: p.claim.fingerprint } : {}),
    },
  };
  const checked = attemptSubmissionSchema.safeParse(submission);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    return { ok: false, error: `This attempt cannot be submitted: ${issue.path.join(".") || "payload"}: ${issue.message}` };
  }
  return { ok: true, payload: JSON.stringify(submission), submission };
}
