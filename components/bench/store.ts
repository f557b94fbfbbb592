"use client";
/**
 * The Bench's client state (zustand). Per-sample data never lives here: the trace goes into
 * TraceBuffer and the store only carries the latest snapshot (for readouts) and a version
 * counter the trend watches outside React's render path.
 */
import { create } from "zustand";
import type { ControllerConfig } from "@/sim/control/config";
import type { DrillInput } from "@/sim/drill/schema";
import type { SampleSnapshot, SimEvent } from "@/sim/drill/simulation";
import type { StampedAction } from "@/sim/drill/actions";
import type { BenchSpeed, FromWorker } from "@/sim/worker/protocol";
import type { BenchTestKind, BenchTestOutcome, BenchTestProgress } from "@/sim/worker/bench-tests";
import type { TemperatureUnit } from "@/sim/units";

export interface DisplayUnits {
  temperature: TemperatureUnit;
  /** how Ti and Td are entered: seconds, minutes, or (Ti only) repeats per minute */
  integral: "s" | "min" | "repeats/min";
  derivative: "s" | "min";
  /** gain Kc in %/°C or proportional band in % of the transmitter span */
  gain: "kc" | "pb";
}

export interface BenchRunSetup {
  plantRef: string;
  plantTitle: string;
  drill: DrillInput;
  controller: ControllerConfig;
  seed: number;
}

/** The relay or bump test the worker runs (or ran last): its live progress and, at the end, its outcome. */
export interface BenchTestState {
  kind: BenchTestKind;
  /** "running" until the outcome arrives */
  status: "running" | "finished";
  progress: BenchTestProgress | null;
  outcome: BenchTestOutcome | null;
}

export interface BenchState {
  setup: BenchRunSetup | null;
  status: "loading" | "paused" | "running";
  speed: BenchSpeed;
  engineVersion: string;
  sampleTimeS: number;
  snapshot: SampleSnapshot | null;
  events: SimEvent[];
  actionLog: StampedAction[];
  error: string | null;
  units: DisplayUnits;
  showTruth: boolean;
  showRaw: boolean;
  helpOpen: boolean;
  /** applied controller configuration (what the worker runs) */
  controller: ControllerConfig | null;
  /** fingerprint of the worker's trace, on request (for replay checks) */
  fingerprint: { rows: number; value: string } | null;
  /** the active or last relay/bump test of this run; null after a load */
  test: BenchTestState | null;
  /** the loaded plant's power curve and the OUT for the last SP asked about (from the worker) */
  powerCurve: Omit<Extract<FromWorker, { type: "power-curve" }>, "type"> | null;
  set: (patch: Partial<BenchState>) => void;
}

export const useBench = create<BenchState>((set) => ({
  setup: null,
  status: "loading",
  speed: 60,
  engineVersion: "",
  sampleTimeS: 0.1,
  snapshot: null,
  events: [],
  actionLog: [],
  error: null,
  units: { temperature: "C", integral: "s", derivative: "s", gain: "kc" },
  showTruth: true,
  showRaw: true,
  helpOpen: false,
  controller: null,
  fingerprint: null,
  test: null,
  powerCurve: null,
  set: (patch) => set(patch),
}));
