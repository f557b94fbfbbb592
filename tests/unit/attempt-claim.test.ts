// The Bench's claim for an attempt is computed by the engine's own code: results and score from
// the trace streamed by the worker's session (chunk by chunk, with tuning changes stamped while it
// runs) equal a headless runDrill of the same drill, starting controller, seed and action log, as
// the server's replay does it (app/_lib/classroom/verify.ts). Also the submission key's reuse and
// the payload's contract (app/_lib/classroom/contracts.ts).
import { describe, expect, it } from "vitest";
import ladder from "@/sim/examples/setpoint-ladder.json";
import { attemptSubmissionSchema } from "@/app/_lib/classroom/contracts";
import { TraceBuffer } from "@/components/bench/trace-buffer";
import { attemptClaim, attemptClaimDetail, buildSubmission, cutTrace, lastSampleOf, submissionKeyFor, SUBMISSION_KEY_PREFIX } from "@/components/attempts/attempt-claim";
import { controllerConfigSchema } from "@/sim/control/config";
import { runDrill } from "@/sim/drill/run-drill";
import { drillSchema, type Drill, type DrillInput } from "@/sim/drill/schema";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import type { SimEvent } from "@/sim/drill/simulation";
import { BenchSession } from "@/sim/worker/bench-session";
import { ENGINE_VERSION } from "@/sim/version";

const SEED = 3141;

/** The cure ladder's first step only (15 min), so the test runs quickly. */
function shortLadder(patch: Partial<DrillInput> = {}): Drill {
  const base = ladder as unknown as DrillInput;
  return drillSchema.parse({
    ...base,
    id: "ladder-first-step",
    events: [{ type: "setpoint", timeS: 300, setpointC: 80 }],
    scoring: { ...base.scoring, windows: [{ id: "step-80", label: "60 → 80 °C", kind: "setpoint", startS: 300, endS: 900, weight: 1 }] },
    durationS: 900,
    ...patch,
  });
}

/** What the Bench does: a session streamed in uneven chunks into a TraceBuffer, tuning changed mid-run. */
function streamed(drill: Drill, changes: { atSample: number; patch: Record<string, unknown> }[]) {
  const controller = controllerConfigSchema.parse(drill.referenceTuning);
  const session = new BenchSession(drill, controller, SEED);
  const buffer = new TraceBuffer(64);
  const events: SimEvent[] = [];
  const drain = () => {
    const c = session.takeChunk();
    if (!c) return;
    buffer.append(c.from, c.trace);
    events.push(...c.events);
  };
  session.stepSamples(1);
  drain();
  let current = controller;
  const pending = [...changes];
  let chunk = 37;
  while (!session.finished) {
    const next = pending[0];
    if (next && session.simulation.sampleIndex >= next.atSample) {
      current = controllerConfigSchema.parse({ ...current, ...next.patch });
      session.act({ type: "tuning", controller: current });
      pending.shift();
    }
    session.stepSamples(chunk);
    chunk = chunk === 37 ? 211 : 37;
    drain();
  }
  const trace = session.simulation.trace();
  return { controller, buffer, events, actions: session.simulation.actionLog, fingerprint: { rows: trace.length, value: traceFingerprint(trace) } };
}

describe("attemptClaim", () => {
  it("equals runDrill's results and score for the same inputs (source: sim/drill/run-drill.ts, the server's replay)", () => {
    const drill = shortLadder();
    const run = streamed(drill, [
      { atSample: 500, patch: { kc: 4.5, ti: 300 } },
      { atSample: 1200, patch: { pvFilterTauS: 2 } },
    ]);
    expect(run.actions.map((a) => a.type)).toEqual(["tuning", "tuning"]);
    const claim = attemptClaim({ drill, controller: run.controller, seed: SEED, actions: run.actions, trace: run.buffer.view(), events: run.events, engineVersion: ENGINE_VERSION, fingerprint: run.fingerprint });

    const official = runDrill(drill, run.controller, run.actions, SEED, { score: true });
    expect(claim.results).toEqual(official.results);
    expect(claim.score).toBe(official.score!.score);
    expect(claim.fingerprint).toBe(traceFingerprint(official.trace));
  });

  it("agrees at a 0.1 s sample time too, where (rows − 1)·Ts is not exactly durationS in binary", () => {
    const drill = shortLadder({ referenceTuning: { ...(ladder as unknown as DrillInput).referenceTuning, sampleTimeS: 0.1 }, durationS: 600, scoring: { windows: [{ id: "step-80", kind: "setpoint", startS: 300, endS: 600 }] } });
    const run = streamed(drill, [{ atSample: 3500, patch: { kc: 7 } }]);
    const claim = attemptClaim({ drill, controller: run.controller, seed: SEED, actions: run.actions, trace: run.buffer.view(), events: run.events, engineVersion: ENGINE_VERSION, fingerprint: run.fingerprint });
    const official = runDrill(drill, run.controller, run.actions, SEED, { score: true });
    expect(claim.results).toEqual(official.results);
    expect(claim.score).toBe(official.score!.score);
  });

  it("the reference tuning itself scores 50 in every window (sim/drill/score.ts: reference → 50)", () => {
    const drill = shortLadder();
    const run = streamed(drill, []);
    const { claim, score } = attemptClaimDetail({ drill, controller: run.controller, seed: SEED, actions: [], trace: run.buffer.view(), events: run.events, engineVersion: ENGINE_VERSION });
    expect(claim.score).toBe(50);
    expect(score.windows.map((w) => w.score)).toEqual([50]);
    expect(claim.fingerprint).toBeUndefined(); // none was passed
  });

  it("ignores rows past the drill's end and omits a fingerprint that does not cover exactly the drill", () => {
    const drill = shortLadder();
    const run = streamed(drill, []);
    const rows = lastSampleOf(drill, run.controller.sampleTimeS) + 1;
    expect(run.buffer.length).toBe(rows);
    expect(cutTrace(run.buffer.view(), rows - 5).length).toBe(rows - 5);
    const claim = attemptClaim({ drill, controller: run.controller, seed: SEED, actions: [], trace: run.buffer.view(), events: run.events, engineVersion: ENGINE_VERSION, fingerprint: { rows: rows + 3, value: "0123456789abcdef" } });
    expect(claim.fingerprint).toBeUndefined();
    expect(() => attemptClaim({ drill, controller: run.controller, seed: SEED, actions: [], trace: cutTrace(run.buffer.view(), rows - 1), events: run.events, engineVersion: ENGINE_VERSION })).toThrow(/has not reached the end/);
  });
});

describe("submission", () => {
  const memoryStorage = () => {
    const m = new Map<string, string>();
    return { getItem: (k: string) => m.get(k) ?? null, setItem: (k: string, v: string) => void m.set(k, v), map: m };
  };

  it("keeps one submission key per attempt in the storage it is given", () => {
    const s = memoryStorage();
    const a = submissionKeyFor("6f1c2d4e-0000-4000-8000-000000000001", s);
    expect(a).toMatch(/^[0-9a-f-]{36}$/);
    expect(submissionKeyFor("6f1c2d4e-0000-4000-8000-000000000001", s)).toBe(a);
    expect(s.map.get(`${SUBMISSION_KEY_PREFIX}6f1c2d4e-0000-4000-8000-000000000001`)).toBe(a);
    expect(submissionKeyFor("6f1c2d4e-0000-4000-8000-000000000002", s)).not.toBe(a);
    // a storage that refuses writes: the page still reuses its key
    const refusing = { getItem: () => null, setItem: () => { throw new Error("quota"); } };
    const b = submissionKeyFor("6f1c2d4e-0000-4000-8000-000000000003", refusing);
    expect(submissionKeyFor("6f1c2d4e-0000-4000-8000-000000000003", refusing)).toBe(b);
  });

  it("builds a payload that parses with attemptSubmissionSchema", () => {
    const drill = shortLadder();
    const run = streamed(drill, [{ atSample: 700, patch: { kc: 5 } }]);
    const claim = attemptClaim({ drill, controller: run.controller, seed: SEED, actions: run.actions, trace: run.buffer.view(), events: run.events, engineVersion: ENGINE_VERSION, fingerprint: run.fingerprint });
    const built = buildSubmission({ attemptId: "6f1c2d4e-0000-4000-8000-000000000001", submissionKey: submissionKeyFor("6f1c2d4e-0000-4000-8000-000000000001", memoryStorage()), controller: run.controller, actionLog: run.actions, claim });
    if (!built.ok) throw new Error(built.error);
    const parsed = attemptSubmissionSchema.parse(JSON.parse(built.payload));
    expect(parsed.actionLog).toHaveLength(1);
    expect(parsed.claimed.score).toBe(claim.score);
    expect(parsed.claimed.fingerprint).toBe(claim.fingerprint);
    expect(buildSubmission({ attemptId: "not-an-id", submissionKey: "also-not", controller: run.controller, actionLog: [], claim })).toMatchObject({ ok: false });
  });
});
