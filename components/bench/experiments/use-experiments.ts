"use client";
/** A handle on the experiments worker: start a set of variants, follow progress, cancel. */
import { useCallback, useEffect, useRef, useState } from "react";
import type { DrillInput } from "@/sim/drill/schema";
import type { Variant, VariantRun } from "@/sim/experiments/variants";
import type { FromExperiments, ToExperiments } from "@/sim/worker/experiments-protocol";

export interface ExperimentState {
  kind: "sweep" | "compare" | "map" | null;
  status: "idle" | "running" | "done" | "cancelled" | "error";
  done: number;
  total: number;
  rows: VariantRun[];
  elapsedMs: number | null;
  error: string | null;
  meta?: { kcAxis?: number[]; tiAxis?: number[]; metric?: string };
}

const idle: ExperimentState = { kind: null, status: "idle", done: 0, total: 0, rows: [], elapsedMs: null, error: null };

export function useExperiments() {
  const worker = useRef<Worker | null>(null);
  const runId = useRef(0);
  const [state, setState] = useState<ExperimentState>(idle);

  useEffect(() => () => worker.current?.terminate(), []);

  const ensureWorker = () => {
    if (worker.current) return worker.current;
    const w = new Worker(new URL("../../../sim/worker/experiments.worker.ts", import.meta.url), { type: "module" });
    w.onmessage = (e: MessageEvent<FromExperiments>) => {
      const m = e.data;
      if (m.id !== runId.current) return;
      setState((s) => {
        switch (m.type) {
          case "row":
            return { ...s, rows: [...s.rows, m.run] };
          case "progress":
            return { ...s, done: m.done, total: m.total };
          case "done":
            return { ...s, status: "done", elapsedMs: m.elapsedMs };
          case "cancelled":
            return { ...s, status: "cancelled" };
          case "error":
            return { ...s, status: "error", error: m.message };
        }
      });
    };
    worker.current = w;
    return w;
  };

  const start = useCallback((kind: ExperimentState["kind"], drill: DrillInput, variants: Variant[], seed: number, meta?: ExperimentState["meta"]) => {
    const id = ++runId.current;
    setState({ ...idle, kind, status: "running", total: variants.length, meta });
    const msg: ToExperiments = { type: "start", id, drill, variants, seed, keepTraces: kind !== "map" };
    ensureWorker().postMessage(msg);
  }, []);

  const cancel = useCallback(() => {
    const msg: ToExperiments = { type: "cancel", id: runId.current };
    worker.current?.postMessage(msg);
  }, []);

  return { state, start, cancel };
}
