/**
 * The Bench's active relay or bump test, worker side. Pure (no worker globals), so the stepping,
 * the time budget, progress throttling and outcomes are tested in Node.
 *
 * While a test is active the worker's tick advances the test (one `step()` per controller sample)
 * instead of the plain session: the test drives the same Simulation, so the trace keeps streaming
 * as usual and the trend shows the test. A test is finished once its outcome exists; the loop has
 * then been handed back by the test itself.
 *
 * Cancelling: RelayTest has `cancel()` (it hands the loop back over its own return samples).
 * BumpTest has none, so a cancelled bump test is handed back here the way BumpTest itself does at
 * its end: manual at the starting OUT, then (after one sample) the operator's SP if SP tracking
 * moved it and the original mode.
 */
import type { ControllerConfig } from "../control/config";
import { BumpTest, type BumpOutcome, type BumpProgress, type BumpTestOptions } from "../tuning/bump/bump-test";
import { RelayTest, type RelayOutcome, type RelayProgress, type RelayTestOptions } from "../tuning/relay/relay-test";
import type { BenchSession } from "./bench-session";

export type BenchTestKind = "relay" | "bump";

export type BenchTestProgress = { test: "relay"; progress: RelayProgress } | { test: "bump"; progress: BumpProgress };

/** A bump test abandoned before it finished (by the operator, or the run reaching its end). */
export interface BumpCancelled {
  ok: false;
  cancelled: true;
  message: string;
  record: BumpOutcome["record"];
}

export type BenchTestOutcome =
  | { test: "relay"; outcome: RelayOutcome; base: ControllerConfig }
  | { test: "bump"; outcome: BumpOutcome | BumpCancelled; base: ControllerConfig };

/** Simulated seconds per wall second, or "max". */
export type TestSpeed = number | "max";

const PROGRESS_EVERY_MS = 100; // about ten progress messages a second

const RUN_ENDED = (test: string) => `the Bench run reached its end before the ${test} test finished; the loop is handed back. Reset the run and start the test earlier`;

export class BenchTests {
  private relay: RelayTest | null = null;
  private bump: BumpTest | null = null;
  private base: ControllerConfig | null = null;
  private bumpHandBack: { out0: number; mode0: "auto" | "manual"; sp0: number; stage: number; message: string } | null = null;
  private finalOutcome: BenchTestOutcome | null = null;
  private lastProgressMs = -Infinity;
  private lastPhase = "";
  private outcomeTaken = false;
  /** the relay test was cut short by the end of the Bench run, not by the operator */
  private runEnded = false;

  constructor(readonly session: BenchSession) {}

  /** A test is running (started and without an outcome yet). */
  get active(): boolean {
    return (this.relay !== null || this.bump !== null) && this.finalOutcome === null;
  }

  get kind(): BenchTestKind | null {
    return this.relay ? "relay" : this.bump ? "bump" : null;
  }

  startRelay(options: RelayTestOptions = {}): void {
    this.reset();
    this.base = this.session.simulation.controllerConfig;
    this.relay = new RelayTest(this.session.simulation, options);
  }

  startBump(options: BumpTestOptions = {}): void {
    this.reset();
    const sim = this.session.simulation;
    this.base = sim.controllerConfig;
    const st = sim.controllerState;
    this.bumpHandBack = { out0: st.out, mode0: st.mode, sp0: st.sp, stage: -1, message: "" };
    this.bump = new BumpTest(sim, options);
  }

  /** Forget the active or finished test. */
  reset(): void {
    this.relay = null;
    this.bump = null;
    this.base = null;
    this.bumpHandBack = null;
    this.finalOutcome = null;
    this.lastProgressMs = -Infinity;
    this.lastPhase = "";
    this.outcomeTaken = false;
    this.runEnded = false;
  }

  /** Abandon the active test; the loop is handed back over the next sample or two. */
  cancel(message = "test cancelled by the operator; the loop is handed back at its starting output"): void {
    if (!this.active) return;
    if (this.relay) this.relay.cancel();
    else if (this.bump && this.bumpHandBack && this.bumpHandBack.stage < 0 && this.bump.phase !== "returning") {
      const sim = this.session.simulation;
      const h = this.bumpHandBack;
      h.stage = 0;
      h.message = message;
      sim.act({ type: "mode", mode: "manual" });
      sim.act({ type: "manual-output", outPercent: h.out0 });
    }
  }

  /** Advance the active test by up to `samples` controller samples; returns the samples done. */
  advance(samples: number): number {
    let done = 0;
    while (done < samples && this.active) {
      this.stepOnce();
      done++;
    }
    return done;
  }

  /** Advance for up to `budgetMs` of wall time, in batches; returns the samples done. */
  runFor(budgetMs: number, now: () => number, batch = 200): number {
    const start = now();
    let done = 0;
    while (this.active && now() - start < budgetMs) done += this.advance(batch);
    return done;
  }

  private stepOnce(): void {
    const sim = this.session.simulation;
    // the Bench run reached its end: a test cannot go on past it
    if (sim.finished) {
      if (this.relay) {
        if (this.relay.phase !== "returning") this.runEnded = true;
        this.relay.cancel(); // no-op once it is handing back
      } else if (this.bump && this.bump.phase !== "returning") this.cancel(RUN_ENDED("bump"));
    }
    if (this.relay) {
      this.relay.step();
      const o = this.relay.outcome;
      if (o) this.finalOutcome = { test: "relay", outcome: this.runEnded && !o.ok && o.code === "cancelled" ? { ...o, message: RUN_ENDED("relay") } : o, base: this.base! };
      return;
    }
    const bump = this.bump!;
    const h = this.bumpHandBack!;
    if (h.stage < 0) {
      bump.step();
      const o = bump.outcome;
      if (o) this.finalOutcome = { test: "bump", outcome: o, base: this.base! };
      return;
    }
    // our own hand-back for a cancelled bump test (as BumpTest's "returning" phase)
    sim.step();
    if (h.stage === 0) {
      if (h.mode0 === "auto") {
        if (sim.controllerConfig.spTrackInManual) sim.act({ type: "setpoint", setpointC: h.sp0 });
        sim.act({ type: "mode", mode: "auto" });
      }
      h.stage = 1;
      return;
    }
    this.finalOutcome = { test: "bump", outcome: { ok: false, cancelled: true, message: h.message, record: bump.record }, base: this.base! };
  }

  /** The active (or last) test's progress, or null without a test. */
  get progress(): BenchTestProgress | null {
    if (this.relay) return { test: "relay", progress: this.relay.progress };
    if (this.bump) {
      const p = this.bump.progress;
      if (this.bumpHandBack && this.bumpHandBack.stage >= 0) return { test: "bump", progress: { ...p, phase: "returning" } };
      return { test: "bump", progress: p };
    }
    return null;
  }

  /** The outcome once the test has finished. */
  get outcome(): BenchTestOutcome | null {
    return this.finalOutcome;
  }

  /** Progress to post now: at most every 100 ms of wall time, and at once when the phase changes. */
  takeProgress(nowMs: number): BenchTestProgress | null {
    const p = this.progress;
    if (!p) return null;
    const phaseChanged = p.progress.phase !== this.lastPhase;
    if (!phaseChanged && nowMs - this.lastProgressMs < PROGRESS_EVERY_MS) return null;
    this.lastProgressMs = nowMs;
    this.lastPhase = p.progress.phase;
    return p;
  }

  /** The outcome, once (for the message to the main thread). */
  takeOutcome(): BenchTestOutcome | null {
    if (!this.finalOutcome || this.outcomeTaken) return null;
    this.outcomeTaken = true;
    return this.finalOutcome;
  }
}
