/// <reference lib="webworker" />
/**
 * The Bench's engine worker: runs a BenchSession at the chosen speed and streams trace chunks
 * back about 40 times a second. The main thread never simulates. While a relay or bump test runs
 * (BenchTests), the tick advances the test instead of the plain session, at the Bench's speed or
 * as fast as possible, and posts its progress about ten times a second and its outcome once.
 */
import { traceFingerprint } from "../drill/trace-hash";
import { BenchSession } from "./bench-session";
import { BenchTests } from "./bench-tests";
import { heatUpTime, outputForSetpoint, powerCurve, staticGainAt, type PowerCurve } from "../tuning/power-curve";
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
/** the active relay or bump test (null between loads) */
let tests: BenchTests | null = null;
/** the test's pace: the Bench's run speed, or as fast as possible */
let testSpeed: "bench" | "max" = "bench";
/** the Bench was running when the test started: it keeps running afterwards, else it pauses */
let runAfterTest = false;
/** the loaded plant's power curve, computed on the first request (simulated for a nonlinear plant) */
let curve: PowerCurve | null = null;

const post = (msg: FromWorker, transfer: Transferable[] = []) => self.postMessage(msg, transfer);

function flush() {
  const chunk = session?.takeChunk();
  if (chunk) post(chunk, transferablesOf(chunk.trace));
}

/** Post the test's progress (about ten times a second) and, once, its outcome. */
function reportTest(force = false) {
  if (!tests) return;
  const p = tests.takeProgress(force ? Infinity : performance.now());
  if (p) post({ type: "test-progress", ...p });
  const o = tests.takeOutcome();
  if (o) post({ type: "test-outcome", ...o });
}

/** Advance the test or the plain session by up to `samples`. */
function stepBy(samples: number) {
  if (tests?.active) tests.advance(samples);
  else session?.stepSamples(samples);
}

function tick() {
  if (!session || !running) return;
  const now = performance.now();
  const wallS = (now - lastTick) / 1000;
  lastTick = now;
  const testing = !!tests?.active;
  const pace = testing && testSpeed === "max" ? "max" : speed;
  if (pace === "max") {
    if (testing) tests!.runFor(MAX_BUDGET_MS, () => performance.now());
    else session.runFor(MAX_BUDGET_MS, () => performance.now());
  } else {
    owedSamples += (wallS * pace) / session.sampleTimeS;
    const due = Math.floor(owedSamples);
    const start = performance.now();
    let done = 0;
    while (done < due && performance.now() - start < MAX_BUDGET_MS) {
      const batch = Math.min(200, due - done);
      stepBy(batch);
      done += batch;
    }
    owedSamples -= done;
    if (owedSamples > 10 * due + 1000) owedSamples = 0; // the worker fell behind: drop the debt rather than lurch
  }
  flush();
  if (testing) {
    reportTest();
    if (!tests!.active) {
      // the test has finished and handed the loop back
      if (!runAfterTest || session.finished) setRunning(false);
      return;
    }
  }
  if (!tests?.active && session.finished) setRunning(false);
}

function startTest(msg: Extract<ToWorker, { type: "relay-start" | "bump-start" }>) {
  if (!session) return;
  if (tests?.active) tests.cancel(); // one test at a time: the new one replaces it
  tests = new BenchTests(session);
  if (msg.type === "relay-start") tests.startRelay(msg.options);
  else tests.startBump(msg.options);
  testSpeed = msg.speed ?? "bench";
  runAfterTest = running;
  reportTest(true);
  if (!running) setRunning(true);
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
  tests = null;
  curve = null;
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
        if (tests?.active) runAfterTest = true;
        setRunning(true);
        break;
      case "pause":
        if (tests?.active) runAfterTest = false;
        setRunning(false);
        break;
      case "step":
        setRunning(false);
        stepBy(Math.max(1, Math.floor(msg.samples)));
        flush();
        reportTest(true);
        break;
      case "relay-start":
      case "bump-start":
        startTest(msg);
        break;
      case "power-curve": {
        if (!session) break;
        const def = session.simulation.plantDefinition;
        curve ??= powerCurve(def);
        const holding = outputForSetpoint(curve, msg.setpointC);
        post({
          type: "power-curve",
          setpointC: msg.setpointC,
          curve,
          holding,
          staticGainCPerPercent: holding.ok ? staticGainAt(curve, holding.outPercent) : null,
          heatUp: heatUpTime(def, msg.setpointC, curve),
        });
        break;
      }
      case "test-cancel":
        if (tests?.active) {
          tests.cancel();
          if (!running) {
            // a paused Bench hands the loop back at once
            tests.advance(4);
            flush();
            reportTest(true);
          }
        }
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
          // (through the test while one is active, so it sees every sample)
          stepBy(1);
          flush();
          reportTest(true);
        }
        break;
    }
  } catch (err) {
    post({ type: "error", message: err instanceof Error ? err.message : String(err) });
  }
};
