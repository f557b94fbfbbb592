"use client";
/**
 * The main thread's handle on the engine worker: sends commands, appends streamed chunks to the
 * TraceBuffer and moves the latest snapshot, events and action log into the store.
 */
import type { ControllerConfigInput } from "@/sim/control/config";
import type { OperatorActionInput, StampedAction } from "@/sim/drill/actions";
import type { DrillInput } from "@/sim/drill/schema";
import type { BumpTestOptions } from "@/sim/tuning/bump/bump-test";
import type { RelayTestOptions } from "@/sim/tuning/relay/relay-test";
import type { BenchSpeed, FromWorker, ToWorker } from "@/sim/worker/protocol";
import { useBench } from "./store";
import { TraceBuffer } from "./trace-buffer";

export class BenchEngine {
  readonly buffer = new TraceBuffer();
  private worker: Worker;

  constructor() {
    this.worker = new Worker(new URL("../../sim/worker/bench.worker.ts", import.meta.url), { type: "module" });
    this.worker.onmessage = (e: MessageEvent<FromWorker>) => this.receive(e.data);
    this.worker.onerror = (e) => useBench.getState().set({ error: e.message || "the engine worker failed" });
  }

  private send(msg: ToWorker) {
    this.worker.postMessage(msg);
  }

  private receive(msg: FromWorker) {
    const store = useBench.getState();
    switch (msg.type) {
      case "loaded":
        this.buffer.clear();
        store.set({ engineVersion: msg.engineVersion, sampleTimeS: msg.sampleTimeS, events: [], actionLog: [], snapshot: null, error: null, fingerprint: null, status: "paused", test: null, powerCurve: null });
        break;
      case "chunk":
        this.buffer.append(msg.from, msg.trace);
        store.set({
          snapshot: msg.snapshot,
          events: msg.events.length ? [...store.events, ...msg.events] : store.events,
          actionLog: msg.actions.length ? [...store.actionLog, ...msg.actions] : store.actionLog,
        });
        break;
      case "status":
        store.set({ status: msg.running ? "running" : "paused", speed: msg.speed });
        break;
      case "fingerprint":
        store.set({ fingerprint: { rows: msg.rows, value: msg.value } });
        break;
      case "error":
        store.set({ error: msg.message });
        break;
      case "power-curve": {
        const { type: _t, ...pc } = msg;
        store.set({ powerCurve: pc });
        store.note({ powerCurve: pc });
        break;
      }
      case "test-progress": {
        const { type: _t, ...progress } = msg;
        const prev = store.test;
        store.set({ test: { kind: msg.test, status: prev?.kind === msg.test && prev.status === "finished" ? "finished" : "running", progress, outcome: prev?.kind === msg.test ? prev.outcome : null } });
        break;
      }
      case "test-outcome": {
        const { type: _t, ...outcome } = msg;
        store.set({ test: { kind: msg.test, status: "finished", progress: store.test?.progress ?? null, outcome } });
        // kept apart from `test`, which the next load clears: the hand-over path needs them after a restart
        if (outcome.test === "relay" && outcome.outcome.ok) {
          const r = outcome.outcome;
          store.note({ relay: { ku: r.ku, puS: r.puS, amplitudeC: r.amplitudeC, dPercent: r.dPercent } });
        } else if (outcome.test === "bump" && outcome.outcome.ok) {
          const id = outcome.outcome.identification;
          store.note({ bumpModel: id.preferred === "sopdt" && id.sopdt ? id.sopdt.model : id.fopdt.model });
        }
        break;
      }
    }
  }

  load(drill: DrillInput, controller: ControllerConfigInput, seed: number, actions: StampedAction[] = []) {
    useBench.getState().set({ status: "loading" });
    this.send({ type: "load", drill, controller, seed, actions });
  }
  run(speed: BenchSpeed) {
    this.send({ type: "run", speed });
  }
  pause() {
    this.send({ type: "pause" });
  }
  step(samples = 1) {
    this.send({ type: "step", samples });
  }
  act(action: OperatorActionInput) {
    this.send({ type: "act", action });
  }
  requestFingerprint() {
    this.send({ type: "fingerprint" });
  }
  reset() {
    this.send({ type: "reset" });
  }
  /** Start a relay test on the loop as it is (the store's test state is replaced). */
  startRelay(options: RelayTestOptions, speed: "bench" | "max" = "bench") {
    useBench.getState().set({ test: { kind: "relay", status: "running", progress: null, outcome: null } });
    this.send({ type: "relay-start", options, speed });
  }
  startBump(options: BumpTestOptions, speed: "bench" | "max" = "bench") {
    useBench.getState().set({ test: { kind: "bump", status: "running", progress: null, outcome: null } });
    this.send({ type: "bump-start", options, speed });
  }
  cancelTest() {
    this.send({ type: "test-cancel" });
  }
  /** Ask for the loaded plant's power curve and the OUT that holds `setpointC` (answer in the store). */
  requestPowerCurve(setpointC: number) {
    this.send({ type: "power-curve", setpointC });
  }
  dispose() {
    this.worker.terminate();
  }
}
