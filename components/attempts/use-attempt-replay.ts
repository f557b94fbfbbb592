"use client";
/**
 * Replays an attempt in the browser from its inputs (drill, starting controller, seed, action log)
 * off the main thread. The experiments worker keeps only time and true temperature of a run, so the
 * review uses the engine's Bench worker instead (sim/worker/bench.worker.ts, loaded with the log
 * and run as fast as it can): it streams the full trace (PV, filtered PV, SP, true temperature,
 * OUT), so the review draws every trace and fingerprints the replay (sim/drill/trace-hash.ts).
 */
import { useEffect, useState } from "react";
import { TraceBuffer } from "@/components/bench/trace-buffer";
import type { SimEvent } from "@/sim/drill/simulation";
import type { StampedAction } from "@/sim/drill/actions";
import type { DrillInput } from "@/sim/drill/schema";
import type { ControllerConfigInput } from "@/sim/control/config";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import type { FromWorker, ToWorker } from "@/sim/worker/protocol";

export interface ReplayInputs {
  drill: Record<string, unknown>;
  controller: Record<string, unknown> | null;
  seed: number;
  actionLog: unknown[] | null;
}

export interface AttemptReplay {
  status: "idle" | "running" | "done" | "error";
  /** the replayed trace (complete once status is "done") */
  buffer: TraceBuffer | null;
  events: SimEvent[];
  /** fraction of the drill replayed, 0–1 */
  progress: number;
  /** traceFingerprint of the full replayed trace (null until done) */
  fingerprint: string | null;
  engineVersion: string | null;
  error: string | null;
}

const IDLE: AttemptReplay = { status: "idle", buffer: null, events: [], progress: 0, fingerprint: null, engineVersion: null, error: null };

/** Makes the engine worker; replaced in tests. */
export type WorkerFactory = () => Worker;
const defaultFactory: WorkerFactory = () => new Worker(new URL("../../sim/worker/bench.worker.ts", import.meta.url), { type: "module" });

/** Replay `inputs` (null: nothing to replay). Re-runs when the inputs' identity changes. */
export function useAttemptReplay(inputs: ReplayInputs | null, makeWorker: WorkerFactory = defaultFactory): AttemptReplay {
  const [state, setState] = useState<AttemptReplay>(IDLE);
  useEffect(() => {
    if (!inputs || !inputs.controller) {
      setState(IDLE);
      return;
    }
    let worker: Worker;
    try {
      worker = makeWorker();
    } catch (err) {
      setState({ ...IDLE, status: "error", error: err instanceof Error ? err.message : String(err) });
      return;
    }
    const buffer = new TraceBuffer();
    let events: SimEvent[] = [];
    const durationS = typeof inputs.drill.durationS === "number" ? inputs.drill.durationS : 0;
    let engineVersion: string | null = null;
    let started = false;
    setState({ ...IDLE, status: "running", buffer });
    worker.onmessage = (e: MessageEvent<FromWorker>) => {
      const m = e.data;
      switch (m.type) {
        case "loaded":
          engineVersion = m.engineVersion;
          break;
        case "chunk": {
          buffer.append(m.from, m.trace);
          if (m.events.length) events = [...events, ...m.events];
          const t = buffer.length ? buffer.columns.timeS[buffer.length - 1] : 0;
          setState((s) => ({ ...s, events, engineVersion, progress: durationS > 0 ? Math.min(1, t / durationS) : 0 }));
          break;
        }
        case "status":
          if (m.running) started = true;
          else if (started) {
            // the run reached the end of the drill: the buffer holds the whole trace
            const fp = traceFingerprint(buffer.view());
            setState((s) => ({ ...s, status: "done", progress: 1, fingerprint: fp, events, engineVersion }));
            worker.terminate();
          }
          break;
        case "error":
          setState((s) => ({ ...s, status: "error", error: m.message }));
          worker.terminate();
          break;
        default:
          break;
      }
    };
    worker.onerror = (e) => setState((s) => ({ ...s, status: "error", error: e.message || "the replay failed" }));
    const load: ToWorker = {
      type: "load",
      drill: inputs.drill as DrillInput,
      controller: inputs.controller as ControllerConfigInput,
      seed: inputs.seed,
      actions: (inputs.actionLog ?? []) as StampedAction[],
    };
    worker.postMessage(load);
    worker.postMessage({ type: "run", speed: "max" } satisfies ToWorker);
    return () => worker.terminate();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [inputs]);
  return state;
}
