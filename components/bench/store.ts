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
import type { ProcessModel } from "@/sim/tuning/models";
import type { ControllerType } from "@/sim/tuning/rules/tuning";

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
  /** what the tests found on this plant; kept across loads (a new sample time is a new run), cleared with a new plant */
  findings: BenchFindings;
  /** a proof test built outside the experiments panel (the hand-over path's site proof test) */
  siteProof: SiteProof | null;
  /** the tuning set last saved on this Bench (the one the technician settles on, unless they pick another) */
  savedTuningSet: { id: string; name: string } | null;
  /** a request to bring one panel into view (the counter makes a repeated request new) */
  focus: { panel: BenchPanelId; n: number } | null;
  set: (patch: Partial<BenchState>) => void;
  requestFocus: (panel: BenchPanelId) => void;
  /** records a finding (merged into the current findings) */
  note: (patch: Partial<BenchFindings>) => void;
  /** records a test's proposal loaded into the controller (a relay test's rule is kept apart: the record pairs it with Ku and Pu) */
  noteApplied: (source: "relay" | "bump", origin: { rule: string; controllerType: ControllerType; model: ProcessModel | null }, controller: ControllerConfig) => void;
}

export type BenchPanelId = "power-curve" | "relay" | "bump" | "proof" | "tuning-sets";

/** The stored drill version a proof test came from; null for a timeline built on the spot. */
export interface DrillVersionRef {
  drillId: string;
  version: number;
  title: string;
}

export interface SiteProof {
  label: string;
  /** the drill to run, its plant already this plant's */
  drill: DrillInput;
  drillVersion: DrillVersionRef | null;
}

/** One proof-test run as it was run (drill, controller, seed) with its headline results. */
export interface ProofRun {
  key: string;
  label: string;
  /** "PI" or "PID": which side of the comparison */
  tuningLabel: string;
  drill: DrillInput;
  drillVersion: DrillVersionRef | null;
  controller: ControllerConfig;
  seed: number;
  /** whole-run IAE on the true temperature, °C·s, and the largest window overshoot, % */
  iae: number | null;
  overshootPct: number | null;
}

export interface BenchFindings {
  /** the last power curve the worker sent (a new load drops `powerCurve` until it is asked again) */
  powerCurve: BenchState["powerCurve"];
  /** the last successful relay test */
  relay: { ku: number; puS: number; amplitudeC: number; dPercent: number } | null;
  /** the model of the last successful bump test (its preferred fit) */
  bumpModel: ProcessModel | null;
  /** the rule of the last relay-test proposal loaded into the controller */
  relayRule: string | null;
  /** the last proposal loaded into the controller: from which test, by which rule */
  applied: { source: "relay" | "bump"; rule: string; controllerType: ControllerType; model: ProcessModel | null; controller: ControllerConfig } | null;
  /** site proof tests run through the PI vs PID comparison, oldest first */
  proofRuns: ProofRun[];
}

export const NO_FINDINGS: BenchFindings = { powerCurve: null, relay: null, relayRule: null, bumpModel: null, applied: null, proofRuns: [] };

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
  findings: NO_FINDINGS,
  siteProof: null,
  savedTuningSet: null,
  focus: null,
  set: (patch) => set(patch),
  requestFocus: (panel) => set((s) => ({ focus: { panel, n: (s.focus?.n ?? 0) + 1 } })),
  note: (patch) => set((s) => ({ findings: { ...s.findings, ...patch } })),
  noteApplied: (source, origin, controller) =>
    set((s) => ({ findings: { ...s.findings, applied: { source, ...origin, controller }, ...(source === "relay" ? { relayRule: origin.rule } : {}) } })),
}));
