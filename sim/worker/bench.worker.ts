/// <reference lib="webworker" />
/**
 * The Bench's engine worker: runs a BenchSession at the chosen speed and streams trace chunks
 * back about 40 times a second. The main thread never simulates.
 */
import { traceFingerprint } from "../drill/trace-hash";
import { BenchSession } from "./bench-session";
import { transferablesOf, type BenchSpeed, type FromWorker, type ToWorker } from "./protocol";

declare const self: DedicatedWorkerGlobalScope;

const TICK_MS = 25; // 40 chunks a second, so the trend can redraw at 30 frames per second or more
const MAX_BUDGET_MS = 15; // of every tick, so the worker stays responsive to commands

let session: BenchSession | null = null;
let loadMessage: Extract<ToWorker, { type: "load" }> | null = null;
let running = false;
let speed: BenchSpeed = 60;
let owedSamples = 0;
let lastTick = 0;
let timer: ReturnType<typeof setInterval> | null = null;

const post = (msg: FromWorker, transfer: Transferable[] = []) => self.postMessage(msg, transfer);

function flush() {
  const chunk = session?.takeChunk();
  if (chunk) post(chunk, transferablesOf(chunk.trace));
}

function tick() {
  if (!session || !running) return;
  const now = performance.now();
  const wallS = (now - lastTick) / 1000;
  lastTick = now;
  if (speed === "max") {
    session.runFor(MAX_BUDGET_MS, () => performance.now());
  } else {
    owedSamples += (wallS * speed) / session.sampleTimeS;
    const due = Math.floor(owedSamples);
    const start = performance.now();
    let done = 0;
    while (done < due && performance.now() - start < MAX_BUDGET_MS) {
      const batch = Math.min(200, due - done);
      session.stepSamples(batch);
      done += batch;
    }
    owedSamples -= done;
    if (owedSamples > 10 * due + 1000) owedSamples = 0; // the worker fell behind: drop the debt rather than lurch
  }
  flush();
  if (session.finished) setRunning(false);
}

function setRunning(on: boolean) {
  running = on;
  if (timer) clearInterval(timer);
  timer = null;
  if (on) {
    lastTick = performance.now();
    owedSamples = 0;
    timer = setInterval(tick, TICK_MS);
  }
  post({ type: "status", running, speed });
}

function load(msg: Extract<ToWorker, { type: "load" }>) {
  loadMessage = msg;
  session = new BenchSession(msg.drill, msg.controller, msg.seed, msg.actions);
  post({ type: "loaded", engineVersion: session.simulation.engineVersion, sampleTimeS: session.sampleTimeS, seed: session.simulation.seed });
  session.stepSamples(1); // the first row, so the faceplate has readings at once
  flush();
}

self.onmessage = (e: MessageEvent<ToWorker>) => {
  const msg = e.data;
  try {
    switch (msg.type) {
      case "load":
        setRunning(false);
        load(msg);
        break;
      case "reset":
        setRunning(false);
        if (loadMessage) load(loadMessage);
        break;
      case "run":
        speed = msg.speed;
        setRunning(true);
        break;
      case "pause":
        setRunning(false);
        break;
      case "step":
        setRunning(false);
        session?.stepSamples(Math.max(1, Math.floor(msg.samples)));
        flush();
        break;
      case "fingerprint": {
        if (!session) break;
        const trace = session.simulation.trace();
        post({ type: "fingerprint", rows: trace.length, value: traceFingerprint(trace) });
        break;
      }
      case "act":
        session?.act(msg.action);
        if (!running) {
          // a paused Bench applies the action on the next sample so the operator sees it land
          session?.stepSamples(1);
          flush();
        }
        break;
    }
  } catch (err) {
    post({ type: "error", message: err instanceof Error ? err.message : String(err) });
  }
};
