"use client";
/**
 * A handle on the experiments workers: start a set of variants, follow progress, cancel. The
 * variants are dealt round-robin to a small pool (one worker per core, at most four), and the
 * rows are merged back in variant order.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import type { RunJob, VariantRun } from "@/sim/experiments/variants";
import type { FromExperiments, ToExperiments } from "@/sim/worker/experiments-protocol";
import type { SiteProof } from "../store";

export interface ExperimentState {
  kind: "sweep" | "compare" | "map" | "saved" | null;
  status: "idle" | "running" | "done" | "cancelled" | "error";
  done: number;
  total: number;
  rows: VariantRun[];
  elapsedMs: number | null;
  error: string | null;
  /** proof: the site proof test every run of a comparison ran (kept so its runs can go on a tuning record) */
  meta?: { kcAxis?: number[]; tiAxis?: number[]; metric?: string; proof?: SiteProof & { seed: number } };
}

const idle: ExperimentState = { kind: null, status: "idle", done: 0, total: 0, rows: [], elapsedMs: null, error: null };

const poolSize = () => Math.max(1, Math.min(4, typeof navigator !== "undefined" ? navigator.hardwareConcurrency || 2 : 2));

export function useExperiments() {
  const workers = useRef<Worker[]>([]);
  const runId = useRef(0);
  const startedAt = useRef(0);
  const pending = useRef(0);
  const [state, setState] = useState<ExperimentState>(idle);

  useEffect(() => () => workers.current.forEach((w) => w.terminate()), []);

  const onMessage = useCallback((slot: number, slots: number) => (e: MessageEvent<FromExperiments>) => {
    const m = e.data;
    if (m.id !== runId.current) return;
    setState((s) => {
      switch (m.type) {
        case "row": {
          // worker `slot` ran variants slot, slot + slots, …: restore the global index
          const run = { ...m.run, index: m.run.index * slots + slot };
          const rows = [...s.rows, run].sort((a, b) => a.index - b.index);
          return { ...s, rows, done: rows.length };
        }
        case "progress":
          return s;
        case "done":
          pending.current -= 1;
          return pending.current === 0 ? { ...s, status: "done", elapsedMs: performance.now() - startedAt.current } : s;
        case "cancelled":
          return { ...s, status: "cancelled" };
        case "error":
          return { ...s, status: "error", error: m.message };
      }
    });
  }, []);

  const ensureWorkers = (n: number) => {
    while (workers.current.length < n) {
      workers.current.push(new Worker(new URL("../../../sim/worker/experiments.worker.ts", import.meta.url), { type: "module" }));
    }
    return workers.current.slice(0, n);
  };

  const start = useCallback(
    (kind: ExperimentState["kind"], jobs: RunJob[], meta?: ExperimentState["meta"]) => {
      const id = ++runId.current;
      const slots = Math.max(1, Math.min(poolSize(), jobs.length));
      setState({ ...idle, kind, status: "running", total: jobs.length, meta });
      startedAt.current = performance.now();
      pending.current = slots;
      ensureWorkers(slots).forEach((w, slot) => {
        w.onmessage = onMessage(slot, slots);
        const mine = jobs.filter((_, i) => i % slots === slot);
        const msg: ToExperiments = { type: "start", id, jobs: mine, keepTraces: kind !== "map" };
        w.postMessage(msg);
      });
    },
    [onMessage],
  );

  const cancel = useCallback(() => {
    const msg: ToExperiments = { type: "cancel", id: runId.current };
    workers.current.forEach((w) => w.postMessage(msg));
  }, []);

  return { state, start, cancel };
}
