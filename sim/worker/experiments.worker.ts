/// <reference lib="webworker" />
/**
 * Runs experiment variants off the main thread and off the live Bench worker, one run at a time,
 * yielding to the event loop between runs so a cancel arrives promptly.
 */
import { runJobs } from "../experiments/variants";
import type { FromExperiments, ToExperiments } from "./experiments-protocol";

declare const self: DedicatedWorkerGlobalScope;

let current = 0;
const cancelled = new Set<number>();
const post = (m: FromExperiments, transfer: Transferable[] = []) => self.postMessage(m, transfer);
const yieldToEvents = () => new Promise<void>((r) => setTimeout(r, 0));

async function start(msg: Extract<ToExperiments, { type: "start" }>) {
  current = msg.id;
  const t0 = performance.now();
  const total = msg.jobs.length;
  try {
    let done = 0;
    for (const run of runJobs(msg.jobs, msg.keepTraces)) {
      done++;
      post({ type: "row", id: msg.id, run }, msg.keepTraces ? [run.timeS.buffer as ArrayBuffer, run.trueC.buffer as ArrayBuffer] : []);
      post({ type: "progress", id: msg.id, done, total });
      await yieldToEvents();
      if (cancelled.has(msg.id) || current !== msg.id) {
        post({ type: "cancelled", id: msg.id });
        return;
      }
    }
    post({ type: "done", id: msg.id, elapsedMs: performance.now() - t0 });
  } catch (err) {
    post({ type: "error", id: msg.id, message: err instanceof Error ? err.message : String(err) });
  }
}

self.onmessage = (e: MessageEvent<ToExperiments>) => {
  const msg = e.data;
  if (msg.type === "cancel") cancelled.add(msg.id);
  else void start(msg);
};
