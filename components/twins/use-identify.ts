"use client";
/**
 * The identification as a cancellable background job: one worker per run (Cancel terminates it,
 * which is the only way to stop a fit midway), the newest request wins, and the elapsed time is
 * kept so the page can say how long it took.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import type { LogMapping } from "@/sim/import";
import type { IdentifyReply } from "./identify-protocol";

export type WorkerFactory = () => Worker;

const defaultFactory: WorkerFactory = () => new Worker(new URL("./identify.worker.ts", import.meta.url), { type: "module" });

export type IdentifyState =
  | { status: "idle" }
  | { status: "running"; startedAt: number }
  | { status: "done"; reply: Extract<IdentifyReply, { ok: true }> }
  | { status: "refused"; message: string };

export function useIdentify(factory: WorkerFactory = defaultFactory) {
  const [state, setState] = useState<IdentifyState>({ status: "idle" });
  const worker = useRef<Worker | null>(null);
  const seq = useRef(0);

  const stop = useCallback(() => {
    worker.current?.terminate();
    worker.current = null;
  }, []);

  const run = useCallback(
    (text: string, byteSize: number, mapping: LogMapping) => {
      stop();
      const id = ++seq.current;
      let w: Worker;
      try {
        w = factory();
      } catch (err) {
        setState({ status: "refused", message: `The identification could not start: ${err instanceof Error ? err.message : String(err)}` });
        return;
      }
      worker.current = w;
      setState({ status: "running", startedAt: performance.now() });
      w.onmessage = (e: MessageEvent<IdentifyReply>) => {
        if (e.data.id !== seq.current) return;
        stop();
        setState(e.data.ok ? { status: "done", reply: e.data } : { status: "refused", message: e.data.message });
      };
      w.onerror = (e) => {
        if (id !== seq.current) return;
        stop();
        setState({ status: "refused", message: `The identification failed: ${e.message || "the worker stopped"}` });
      };
      w.postMessage({ id, text, byteSize, mapping });
    },
    [factory, stop],
  );

  const cancel = useCallback(() => {
    seq.current++;
    stop();
    setState({ status: "idle" });
  }, [stop]);

  useEffect(() => stop, [stop]);
  return { state, run, cancel };
}
